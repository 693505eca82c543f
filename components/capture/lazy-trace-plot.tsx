"use client";
// The trace plot loaded after the page: uPlot (about 22 kB gzip) stays out
// of the capture pages' first-load JavaScript (scripts/bench/pages.ts).
import dynamic from "next/dynamic";

export const LazyTracePlot = dynamic(() => import("./trace-plot").then((m) => m.TracePlot), {
  ssr: false,
  loading: () => <p className="min-h-[260px] text-ink-soft">Loading the trace…</p>,
});
