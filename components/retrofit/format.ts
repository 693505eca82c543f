// Number printing for the workspace: engineering notation with units, errors
// in ppm, ratios in percent. NaN prints as a dash.
import { formatEng } from "@/lib/engine";

export const fmtS = (v: number, digits = 4) => formatEng(v, "s", digits);
export const fmtHz = (v: number, digits = 4) => formatEng(v, "Hz", digits);
export const fmtV = (v: number, digits = 3) => formatEng(v, "V", digits);
export const fmtPct = (ratio: number, digits = 3) =>
  Number.isFinite(ratio) ? formatEng(ratio, "%", digits) : "—";
export function fmtPpm(ppm: number, digits = 3): string {
  if (!Number.isFinite(ppm)) return "—";
  return `${Number(ppm.toPrecision(digits))} ppm`;
}
