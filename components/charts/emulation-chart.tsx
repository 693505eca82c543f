"use client";
// The emulated pin output (from the edges the emulator saw) under the planned
// waveform, as steps over three periods from the first rising edge.
import { useMemo } from "react";
import type uPlot from "uplot";
import { formatEng } from "@/lib/engine";
import { traceOf } from "@/lib/revisions/emulation-trace";
import { LazyUplotChart } from "./lazy";

const INK = "#1f2933";
const ACCENT = "#b45309";
/** The plan is drawn above the emulated pin: levels 1.5 (low) and 2.5 (high). */
const PLAN_OFFSET = 1.5;

export function EmulationChart({
  planned,
  edges,
  label,
}: {
  planned: { periodS: number; highS: number };
  edges?: { t: number; level: 0 | 1 }[];
  label: string;
}) {
  const data = useMemo<uPlot.AlignedData>(() => {
    const tr = traceOf(planned, edges);
    return [tr.t, tr.planned.map((v) => v + PLAN_OFFSET), tr.emulated];
  }, [planned, edges]);
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
              t === 0 || t === PLAN_OFFSET ? "low" : t === 1 || t === 1 + PLAN_OFFSET ? "high" : "",
            ),
          splits: () => [0, 1, PLAN_OFFSET, 1 + PLAN_OFFSET],
        },
      ],
      series: [
        { label: "t", value: (_u, v) => (v == null ? "—" : formatEng(v, "s", 4)) },
        {
          label: "plan",
          stroke: INK,
          width: 1.5,
          dash: [5, 3],
          value: (_u, v) => (v == null ? "—" : v - PLAN_OFFSET >= 0.5 ? "high" : "low"),
        },
        {
          label: "emulated pin",
          stroke: ACCENT,
          width: 1.5,
          value: (_u, v) => (v == null ? "not run" : v >= 0.5 ? "high" : "low"),
        },
      ],
    }),
    [],
  );
  return <LazyUplotChart options={options} data={data} label={label} />;
}
