"use client";
// Two revisions' emulated pin outputs of one target on one time axis, each
// from its own first rising edge: the older dashed above, the newer solid.
import { useMemo } from "react";
import type uPlot from "uplot";
import { overlayOf } from "@/lib/revisions/emulation-overlay";
import { LazyUplotChart } from "./lazy";
import { twoStepOptions, UPPER_OFFSET } from "./two-step-options";

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
    return [p.t, p.older.map((v) => (v === null ? null : v + UPPER_OFFSET)), p.newer];
  }, [older, newer, spanS]);
  const [olderName, newerName] = names;
  const options = useMemo(
    () => twoStepOptions(`${olderName} emulated`, `${newerName} emulated`),
    [olderName, newerName],
  );
  return <LazyUplotChart options={options} data={data} label={label} />;
}
