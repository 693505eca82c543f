"use client";
// The emulated pin output (from the edges the emulator saw) under the planned
// waveform, as steps over three periods from the first rising edge.
import { useMemo } from "react";
import type uPlot from "uplot";
import { traceOf } from "@/lib/revisions/emulation-trace";
import { LazyUplotChart } from "./lazy";
import { twoStepOptions, UPPER_OFFSET } from "./two-step-options";

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
    return [tr.t, tr.planned.map((v) => v + UPPER_OFFSET), tr.emulated];
  }, [planned, edges]);
  const options = useMemo(() => twoStepOptions("plan", "emulated pin", "not run"), []);
  return <LazyUplotChart options={options} data={data} label={label} />;
}
