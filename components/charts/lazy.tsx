"use client";
// uPlot touches `window` when loaded, so the chart loads in the browser only.
import dynamic from "next/dynamic";

export const LazyUplotChart = dynamic(() => import("./uplot-chart"), {
  ssr: false,
  loading: () => <div className="h-48 animate-pulse rounded bg-paper-sunk" aria-hidden="true" />,
});
