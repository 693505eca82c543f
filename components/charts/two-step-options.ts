// uPlot options for two logic-level step traces on one time axis: the upper
// one dashed in ink (drawn at levels 1.5/2.5), the lower one solid in the
// accent colour (0/1). The emulation chart (plan over emulated pin) and the
// compare overlay (older over newer revision) both use it.
import type uPlot from "uplot";
import { formatEng } from "@/lib/engine";

const INK = "#1f2933";
const ACCENT = "#b45309";
/** The upper trace is drawn above the lower: levels 1.5 (low) and 2.5 (high). */
export const UPPER_OFFSET = 1.5;

const level = (v: number) => (v >= 0.5 ? "high" : "low");

export function twoStepOptions(
  upper: string,
  lower: string,
  lowerMissing = "—",
): Omit<uPlot.Options, "width"> {
  return {
    height: 160,
    legend: { show: true },
    scales: { x: { time: false }, y: { range: [-0.2, 2.8] } },
    axes: [
      { values: (_u, ticks) => ticks.map((t) => formatEng(t, "s", 3)), stroke: INK },
      {
        stroke: INK,
        values: (_u, ticks) =>
          ticks.map((t) =>
            t === 0 || t === UPPER_OFFSET ? "low" : t === 1 || t === 1 + UPPER_OFFSET ? "high" : "",
          ),
        splits: () => [0, 1, UPPER_OFFSET, 1 + UPPER_OFFSET],
      },
    ],
    series: [
      { label: "t", value: (_u, v) => (v == null ? "—" : formatEng(v, "s", 4)) },
      {
        label: upper,
        stroke: INK,
        width: 1.5,
        dash: [5, 3],
        value: (_u, v) => (v == null ? "—" : level(v - UPPER_OFFSET)),
      },
      {
        label: lower,
        stroke: ACCENT,
        width: 1.5,
        value: (_u, v) => (v == null ? lowerMissing : level(v)),
      },
    ],
  };
}
