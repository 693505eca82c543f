"use client";
// Monte Carlo period histogram from the analysis spread, drawn as bars.
import { useMemo } from "react";
import type uPlotType from "uplot";
import type { Histogram } from "@/lib/engine";
import { formatEng } from "@/lib/engine";
import { LazyUplotChart } from "./lazy";

const ACCENT = "#b45309";

export function HistogramChart({ histogram, samples }: { histogram: Histogram; samples: number }) {
  const data = useMemo<uPlotType.AlignedData>(() => {
    const xs = histogram.counts.map((_, i) => histogram.binStartS + (i + 0.5) * histogram.binWidthS);
    return [xs, histogram.counts];
  }, [histogram]);

  const options = useMemo<Omit<uPlotType.Options, "width">>(
    () => ({
      height: 180,
      legend: { show: false },
      scales: { x: { time: false } },
      axes: [
        { values: (_u, ticks) => ticks.map((t) => formatEng(t, "s", 3)) },
        { label: "samples", size: 60 },
      ],
      series: [
        {},
        {
          label: "samples",
          fill: "rgba(180, 83, 9, 0.35)",
          stroke: ACCENT,
          points: { show: false },
        },
      ],
    }),
    [],
  );

  return (
    <LazyUplotChart
      options={options}
      data={data}
      bars
      label={`Period histogram of ${samples} Monte Carlo samples, bins of ${formatEng(histogram.binWidthS, "s")}`}
    />
  );
}
