"use client";
// Live analysis of the old stage: timing, checks, spread, waveform sketch and
// tolerance histogram. Computed in the browser by the engine itself.
import { HistogramChart } from "@/components/charts/histogram-chart";
import { WaveformChart } from "@/components/charts/waveform-chart";
import { ControlFields } from "./control-fields";
import type { Stage, StageAnalysis } from "@/lib/engine";
import { fmtHz, fmtPct, fmtS } from "./format";

function Row({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="flex justify-between gap-3 border-b border-paper-line py-1">
      <dt className="text-ink-soft">{label}</dt>
      <dd className="num" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

export function AnalysisPanel({
  stage,
  analysis,
  error,
}: {
  stage: Stage | null;
  analysis: StageAnalysis | null;
  error: string | null;
}) {
  if (!stage || !analysis) {
    return (
      <section aria-labelledby="analysis-title" className="panel">
        <h2 id="analysis-title" className="font-semibold">
          Analysis
        </h2>
        <p className="mt-2 text-sm text-ink-soft" role="status">
          {error ?? "Enter the stage values to see its timing."}
        </p>
      </section>
    );
  }
  const mc = analysis.spread?.monteCarlo;
  const corners = analysis.spread?.corners;
  return (
    <section aria-labelledby="analysis-title" className="panel space-y-3" aria-live="polite">
      <h2 id="analysis-title" className="font-semibold">
        Analysis
      </h2>
      <p className="text-sm text-ink-soft">{analysis.outputLabel}</p>
      <dl className="grid gap-x-6 text-sm sm:grid-cols-2">
        <Row label="Period" value={fmtS(analysis.periodS)} testId="analysis-period" />
        <Row label="Frequency" value={fmtHz(analysis.frequencyHz)} testId="analysis-frequency" />
        <Row label="High time" value={fmtS(analysis.highS)} testId="analysis-high" />
        <Row label="Low time" value={fmtS(analysis.lowS)} />
        <Row label="Duty cycle" value={fmtPct(analysis.duty)} />
        <Row label="Oscillates" value={analysis.oscillates ? "yes" : "no"} testId="analysis-oscillates" />
      </dl>
      {analysis.checks.length > 0 && (
        <ul className="space-y-1 text-sm" aria-label="Checks">
          {analysis.checks.map((c, i) => (
            <li
              key={i}
              className={`rounded border-l-4 px-2 py-1 ${c.level === "error" ? "border-hazard bg-hazard-soft" : "border-accent bg-accent-soft"}`}
            >
              <span className="font-semibold">{c.level === "error" ? "Error" : "Warning"}:</span> {c.message}
            </li>
          ))}
        </ul>
      )}
      {corners && mc && (
        <div className="space-y-1 text-sm">
          <h3 className="font-medium">Spread from the tolerances</h3>
          <dl className="grid gap-x-6 sm:grid-cols-2">
            <Row
              label={`Corners (${corners.count}), period`}
              value={`${fmtS(corners.periodS.min)} … ${fmtS(corners.periodS.max)}`}
            />
            <Row
              label="Corners, high time"
              value={`${fmtS(corners.highS.min)} … ${fmtS(corners.highS.max)}`}
            />
            <Row label={`Monte Carlo (${mc.samples}), median period`} value={fmtS(mc.periodS.median)} />
            <Row
              label="Period 0.135 % … 99.865 %"
              value={`${fmtS(mc.periodS.q00135)} … ${fmtS(mc.periodS.q99865)}`}
            />
          </dl>
        </div>
      )}
      <div>
        <h3 className="text-sm font-medium">Waveform sketch, two periods</h3>
        <WaveformChart stage={stage} analysis={analysis} />
      </div>
      <ControlFields stage={stage} />
      {mc && (
        <div>
          <h3 className="text-sm font-medium">Period histogram</h3>
          <HistogramChart histogram={mc.histogram} samples={mc.samples} />
        </div>
      )}
    </section>
  );
}
