"use client";
// A thin React wrapper around uPlot: one instance per mount, data updates
// through setData (no re-creation), width follows the container. uPlot draws
// to a canvas and stays smooth with 100 000 points per series.
import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

export type UplotChartProps = {
  options: Omit<uPlot.Options, "width">;
  data: uPlot.AlignedData;
  label: string;
  /** Draw every series after x as bars (histograms). */
  bars?: boolean;
};

export default function UplotChart({ options, data, label, bars }: UplotChartProps) {
  const box = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const series = bars
      ? options.series.map((s, i) =>
          i === 0 ? s : { ...s, paths: uPlot.paths.bars?.({ size: [0.9, Infinity] }) },
        )
      : options.series;
    const u = new uPlot({ ...options, series, width: Math.max(200, el.clientWidth) }, data, el);
    plot.current = u;
    const ro = new ResizeObserver(() =>
      u.setSize({ width: Math.max(200, el.clientWidth), height: options.height }),
    );
    ro.observe(el);
    return () => {
      ro.disconnect();
      u.destroy();
      plot.current = null;
    };
    // The options object is rebuilt by callers only when its shape changes.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [options, bars]);

  useEffect(() => {
    plot.current?.setData(data);
  }, [data]);

  return <div ref={box} role="img" aria-label={label} className="w-full overflow-hidden" />;
}
