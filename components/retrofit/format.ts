// Number printing for the workspace: engineering notation with units, errors
// in ppm (percent or a ratio when large), ratios as plain decimals. NaN prints as a dash.
import { formatEng, formatPpm, formatRatio, listDevices } from "@/lib/engine";

export const fmtS = (v: number, digits = 4) => formatEng(v, "s", digits);
export const fmtHz = (v: number, digits = 4) => formatEng(v, "Hz", digits);
export const fmtV = (v: number, digits = 3) => formatEng(v, "V", digits);
export const fmtPct = (ratio: number, digits = 3) =>
  Number.isFinite(ratio) ? formatEng(ratio, "%", digits) : "—";
/** ppm while small, % or a ratio past that (engine formatPpm, the one rule). */
export const fmtPpm = (ppm: number, digits = 3) => formatPpm(ppm, digits);
export const fmtRatio = (v: number, digits = 3) => formatRatio(v, digits);

const DEVICE_NAMES = new Map<string, string>(listDevices().map((d) => [d.id, d.name]));

/** A device as its datasheet writes it ("ATmega328P"), never the lower-case id. */
export const deviceName = (id: string) => DEVICE_NAMES.get(id) ?? id;
