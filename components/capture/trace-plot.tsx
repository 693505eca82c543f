"use client";
// The decimated trace (min/max envelope per pixel column) with the state
// levels, the 50 % reference level and the detected edges. Drag across the
// plot to zoom: the server reads that window from the levels stored at upload, so a zoom
// shows the real samples, not a stretched envelope.
import { useEffect, useRef, useState } from "react";
import useSWR from "swr";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";
import { fetchJson } from "@/lib/client/fetch-json";
import { formatEng } from "@/lib/engine";
import type { CapturePlot } from "@/lib/field/shapes";

function toData(p: CapturePlot): uPlot.AlignedData {
  const x = p.points.map((q) => q.tS);
  const flat = (v: number) => x.map(() => v);
  return [
    x,
    p.points.map((q) => q.maxV),
    p.points.map((q) => q.minV),
    flat(p.highLevelV),
    flat(p.lowLevelV),
    flat(p.referenceV.p50),
  ];
}

export function TracePlot({ captureId }: { captureId: number }) {
  const { data: full, error } = useSWR<CapturePlot>(`/api/v1/captures/${captureId}/plot`);
  const box = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);
  const edges = useRef<CapturePlot["edges"]>([]);
  const [zoomed, setZoomed] = useState(false);
  const [loadingWindow, setLoadingWindow] = useState(false);

  useEffect(() => {
    if (!full || !box.current) return;
    edges.current = full.edges;
    const el = box.current;
    let timer: ReturnType<typeof setTimeout> | undefined;
    let ignoreScale = false;
    const opts: uPlot.Options = {
      width: el.clientWidth,
      height: 260,
      scales: { x: { time: false } },
      axes: [
        { values: (_u, ticks) => ticks.map((t) => formatEng(t, "s", 3)), size: 40 },
        { values: (_u, ticks) => ticks.map((t) => formatEng(t, "V", 3)), size: 60 },
      ],
      series: [
        { label: "t", value: (_u, v) => (v == null ? "—" : formatEng(v, "s", 6)) },
        { label: "max", stroke: "#1d1f21", width: 1 },
        { label: "min", stroke: "#1d1f21", width: 1 },
        { label: "high state", stroke: "#1f6f43", dash: [6, 4], width: 1, points: { show: false } },
        { label: "low state", stroke: "#1f6f43", dash: [6, 4], width: 1, points: { show: false } },
        { label: "50 %", stroke: "#b4530d", dash: [2, 4], width: 1, points: { show: false } },
      ],
      bands: [{ series: [1, 2], fill: "rgba(29,31,33,0.15)" }],
      legend: { live: true },
      hooks: {
        // Edges as short ticks at the 50 % crossing instants (rise up, fall down).
        draw: [
          (u) => {
            const ctx = u.ctx;
            const [min, max] = [u.scales.x.min ?? -Infinity, u.scales.x.max ?? Infinity];
            const y = u.valToPos(full.referenceV.p50, "y", true);
            ctx.save();
            ctx.lineWidth = 2 * devicePixelRatio;
            for (const e of edges.current) {
              if (e.tS < min || e.tS > max) continue;
              const x = u.valToPos(e.tS, "x", true);
              ctx.strokeStyle = e.kind === "rise" ? "#b4530d" : "#5d636a";
              ctx.beginPath();
              ctx.moveTo(x, y - 8 * devicePixelRatio);
              ctx.lineTo(x, y + 8 * devicePixelRatio);
              ctx.stroke();
            }
            ctx.restore();
          },
        ],
        setScale: [
          (u, key) => {
            if (key !== "x" || ignoreScale) return;
            const from = u.scales.x.min;
            const to = u.scales.x.max;
            if (from == null || to == null) return;
            const wide = to - from >= full.durationS * 0.999;
            clearTimeout(timer);
            timer = setTimeout(async () => {
              if (wide) return;
              setZoomed(true);
              setLoadingWindow(true);
              try {
                const w = await fetchJson<CapturePlot>(
                  `/api/v1/captures/${captureId}/plot?fromS=${from}&toS=${to}`,
                );
                edges.current = w.edges.length ? w.edges : edges.current;
                ignoreScale = true;
                u.setData(toData(w), false);
                u.setScale("x", { min: from, max: to });
                ignoreScale = false;
              } catch {
                // Keep the coarse view; the envelope is still right, only less detailed.
              } finally {
                setLoadingWindow(false);
              }
            }, 250);
          },
        ],
      },
    };
    const u = new uPlot(opts, toData(full), el);
    plot.current = u;
    const resize = new ResizeObserver(() => u.setSize({ width: el.clientWidth, height: 260 }));
    resize.observe(el);
    return () => {
      clearTimeout(timer);
      resize.disconnect();
      u.destroy();
      plot.current = null;
    };
  }, [full, captureId]);

  function reset() {
    if (!full || !plot.current) return;
    edges.current = full.edges;
    plot.current.setData(toData(full));
    setZoomed(false);
  }

  if (error) {
    return (
      <p role="alert" className="field-error">
        The trace could not be loaded: {(error as Error).message}
      </p>
    );
  }
  return (
    <figure className="flex flex-col gap-2" aria-label="Captured trace">
      <div ref={box} className="w-full min-h-[260px]" data-testid="trace-plot">
        {!full && <p className="text-ink-soft">Loading the trace…</p>}
      </div>
      <figcaption className="flex flex-wrap items-center gap-3 text-sm text-ink-soft">
        <span>Drag across the plot to zoom in; ticks mark the detected edges at the 50 % level.</span>
        {loadingWindow && <span>Reading the window…</span>}
        {zoomed && (
          <button type="button" className="btn px-2 py-0.5 text-xs" onClick={reset}>
            Show the whole record
          </button>
        )}
      </figcaption>
    </figure>
  );
}
