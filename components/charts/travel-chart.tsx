"use client";
// Timing over a control's travel: the stage's period (or firing delay) against
// rotation, with the tolerance band; where the stage stops, the line breaks.
import { useMemo } from "react";
import type uPlotType from "uplot";
import { formatEng, type TravelAnalysis } from "@/lib/engine";
import { LazyUplotChart } from "./lazy";

const ACCENT = "#b45309";

export function TravelChart({ travel }: { travel: TravelAnalysis }) {
  const selector = travel.control.kind === "selector";
  const data = useMemo<uPlotType.AlignedData>(() => {
    const xs = travel.points.map((p) => (selector ? p.position + 1 : p.position * 100));
    // null leaves a gap where the stage does not run
    const v = (n: number | undefined) => (n !== undefined && Number.isFinite(n) ? n : null);
    return [
      xs,
      travel.points.map((p) => v(p.timingS)),
      travel.points.map((p) => v(p.band?.min)),
      travel.points.map((p) => v(p.band?.max)),
    ];
  }, [travel, selector]);

  const what = travel.quantity === "firingDelayS" ? "firing delay" : "period";
  const options = useMemo<Omit<uPlotType.Options, "width">>(
    () => ({
      height: 200,
      legend: { show: false },
      scales: { x: { time: false } },
      axes: [
        { label: selector ? "switch position" : "rotation (%)" },
        { label: what, size: 70, values: (_u, ticks) => ticks.map((t) => formatEng(t, "s", 3)) },
      ],
      series: [
        {},
        { label: what, stroke: ACCENT, width: 2, points: { show: selector } },
        { label: "tolerance low", stroke: "rgba(180, 83, 9, 0.45)", dash: [4, 4], points: { show: false } },
        { label: "tolerance high", stroke: "rgba(180, 83, 9, 0.45)", dash: [4, 4], points: { show: false } },
      ],
    }),
    [selector, what],
  );

  return (
    <LazyUplotChart
      options={options}
      data={data}
      label={`The stage's ${what} over the control's travel, with the tolerance band dashed${travel.limits.length ? "; the line stops where the stage stops running" : ""}`}
    />
  );
}
