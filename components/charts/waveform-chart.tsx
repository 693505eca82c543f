"use client";
// Capacitor voltage and output level over two periods (engine stageWaveform),
// time axis in engineering notation.
import { useMemo } from "react";
import type uPlot from "uplot";
import { formatEng, stageWaveform, type Stage, type StageAnalysis } from "@/lib/engine";
import { LazyUplotChart } from "./lazy";

const INK = "#1f2933";
const ACCENT = "#b45309";

export function WaveformChart({ stage, analysis }: { stage: Stage; analysis: StageAnalysis }) {
  const data = useMemo<uPlot.AlignedData>(() => {
    const pts = stageWaveform(stage, analysis, 800);
    return [
      pts.map((p) => p.tS),
      pts.map((p) => (Number.isFinite(p.capV) ? p.capV : null)),
      pts.map((p) => p.out),
    ];
  }, [stage, analysis]);

  const options = useMemo<Omit<uPlot.Options, "width">>(
    () => ({
      height: 200,
      legend: { show: true },
      scales: { x: { time: false }, out: { range: [-0.05, 1.3] } },
      axes: [
        { values: (_u, ticks) => ticks.map((t) => formatEng(t, "s", 3)), stroke: INK },
        {
          label: "capacitor",
          values: (_u, ticks) => ticks.map((t) => formatEng(t, "V", 3)),
          stroke: INK,
          size: 70,
        },
        {
          scale: "out",
          side: 1,
          label: "output",
          values: (_u, ticks) => ticks.map((t) => (t === 0 ? "low" : t === 1 ? "high" : "")),
          stroke: INK,
        },
      ],
      series: [
        { label: "t", value: (_u, v) => (v == null ? "—" : formatEng(v, "s", 4)) },
        {
          label: "capacitor",
          stroke: INK,
          width: 1.5,
          value: (_u, v) => (v == null ? "—" : formatEng(v, "V", 4)),
        },
        {
          label: "output",
          scale: "out",
          stroke: ACCENT,
          width: 1.5,
          value: (_u, v) => (v == null ? "—" : v >= 0.5 ? "high" : "low"),
        },
      ],
    }),
    [],
  );

  if (data[0].length === 0)
    return <p className="text-sm text-ink-soft">No waveform: the stage does not oscillate.</p>;
  return (
    <LazyUplotChart
      options={options}
      data={data}
      label={`Waveform sketch over two periods of ${formatEng(analysis.periodS, "s")}`}
    />
  );
}
