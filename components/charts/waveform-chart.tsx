"use client";
// Capacitor voltage and output level over two periods (engine stageWaveform,
// points at the edges), time axis in engineering notation; a measured stage
// shows its output only.
import { useMemo } from "react";
import type uPlot from "uplot";
import { formatEng, stageWaveform, type Stage, type StageAnalysis } from "@/lib/engine";
import { LazyUplotChart } from "./lazy";

const INK = "#1f2933";
const ACCENT = "#b45309";

export function WaveformChart({ stage, analysis }: { stage: Stage; analysis: StageAnalysis }) {
  // A measured stage has no modelled capacitor: draw (and name) only its output.
  const measured = stage.kind === "measured";
  const data = useMemo<uPlot.AlignedData>(() => {
    // Points come from the edges (event-based), so narrow pulses are drawn.
    const pts = stageWaveform(stage, analysis, 800);
    const t = pts.map((p) => p.tS);
    const out = pts.map((p) => p.out);
    if (measured) return [t, out];
    return [t, pts.map((p) => (Number.isFinite(p.capV) ? p.capV : null)), out];
  }, [stage, analysis, measured]);

  const options = useMemo<Omit<uPlot.Options, "width">>(() => {
    const outLabel = measured ? "measured output" : "output";
    const time: uPlot.Axis = { values: (_u, ticks) => ticks.map((t) => formatEng(t, "s", 3)), stroke: INK };
    const outAxis: uPlot.Axis = {
      scale: "out",
      side: measured ? 3 : 1,
      label: outLabel,
      values: (_u, ticks) => ticks.map((t) => (t === 0 ? "low" : t === 1 ? "high" : "")),
      stroke: INK,
    };
    const outSeries: uPlot.Series = {
      label: outLabel,
      scale: "out",
      stroke: ACCENT,
      width: 1.5,
      value: (_u, v) => (v == null ? "—" : v >= 0.5 ? "high" : "low"),
    };
    const tSeries: uPlot.Series = { label: "t", value: (_u, v) => (v == null ? "—" : formatEng(v, "s", 4)) };
    return {
      height: 200,
      legend: { show: true },
      scales: { x: { time: false }, out: { range: [-0.05, 1.3] } },
      axes: measured
        ? [time, outAxis]
        : [
            time,
            {
              label: "capacitor",
              values: (_u, ticks) => ticks.map((t) => formatEng(t, "V", 3)),
              stroke: INK,
              size: 70,
            },
            outAxis,
          ],
      series: measured
        ? [tSeries, outSeries]
        : [
            tSeries,
            {
              label: "capacitor",
              stroke: INK,
              width: 1.5,
              value: (_u, v) => (v == null ? "—" : formatEng(v, "V", 4)),
            },
            outSeries,
          ],
    };
  }, [measured]);

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
