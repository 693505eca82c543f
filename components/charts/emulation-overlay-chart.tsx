"use client";
// Two revisions' emulated pin outputs of one target on one time axis, each
// from its own first rising edge: the older dashed above, the newer solid.
import { useMemo } from "react";
import type uPlot from "uplot";
import { formatEng } from "@/lib/engine";
import { overlayOf } from "@/lib/revisions/emulation-overlay";
import { LazyUplotChart } from "./lazy";

const INK = "#1f2933";
const ACCENT = "#b45309";
/** The older trace is drawn above the newer: levels 1.5 (low) and 2.5 (high). */
const OLDER_OFFSET = 1.5;

type Edge = { t: number; level: 0 | 1 };

export function EmulationOverlayChart({
  older,
  newer,
  spanS,
  names,
  label,
}: {
  older?: Edge[];
  newer?: Edge[];
  spanS: number;
  /** legend names, e.g. ["r1", "r2"] */
  names: [string, string];
  label: string;
}) {
  const data = useMemo<uPlot.AlignedData>(() => {
    const p = overlayOf(older, newer, spanS);
    return [p.t, p.older.map((v) => (v === null ? null : v + OLDER_OFFSET)), p.newer];
  }, [older, newer, spanS]);
  const options = useMemo<Omit<uPlot.Options, "width">>(
    () => ({
      height: 160,
      legend: { show: true },
      scales: { x: { time: false }, y: { range: [-0.2, 2.8] } },
      axes: [
        { values: (_u, ticks) => ticks.map((t) => formatEng(t, "s", 3)), stroke: INK },
        {
          stroke: INK,
          values: (_u, ticks) =>
            ticks.map((t) =>
              t === 0 || t === OLDER_OFFSET ? "low" : t === 1 || t === 1 + OLDER_OFFSET ? "high" : "",
            ),
          splits: () => [0, 1, OLDER_OFFSET, 1 + OLDER_OFFSET],
        },
      ],
      series: [
        { label: "t", value: (_u, v) => (v == null ? "—" : formatEng(v, "s", 4)) },
        {
          label: `${names[0]} emulated`,
          stroke: INK,
          width: 1.5,
          dash: [5, 3],
          value: (_u, v) => (v == null ? "—" : v - OLDER_OFFSET >= 0.5 ? "high" : "low"),
        },
        {
          label: `${names[1]} emulated`,
          stroke: ACCENT,
          width: 1.5,
          value: (_u, v) => (v == null ? "—" : v >= 0.5 ? "high" : "low"),
        },
      ],
    }),
    [names],
  );
  return <LazyUplotChart options={options} data={data} label={label} />;
}
