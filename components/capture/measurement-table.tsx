// The measurement of a capture (IEEE Std 181-2011 terms): state levels, and
// mean, standard deviation, min, max and count of each timing parameter.
import { formatEng } from "@/lib/engine";
import type { CaptureStats } from "@/lib/capture";
import type { MeasurementSummary } from "@/lib/field/shapes";
import { ScalingNote } from "./scaling-note";
import { StandoffEstimate } from "./standoff-estimate";

function StatRow({ label, s, unit = "s" }: { label: string; s: CaptureStats; unit?: "s" | "V" }) {
  const f = (x: number) => formatEng(x, unit, 5);
  return (
    <tr>
      <th scope="row" className="font-normal">
        {label}
      </th>
      <td className="num whitespace-nowrap">{f(s.mean)}</td>
      <td className="num whitespace-nowrap">{f(s.std)}</td>
      <td className="num whitespace-nowrap">{f(s.min)}</td>
      <td className="num whitespace-nowrap">{f(s.max)}</td>
      <td className="num">{s.count}</td>
    </tr>
  );
}

export function MeasurementTable({ m }: { m: MeasurementSummary }) {
  const ramp = m.waveform === "ramp" && m.peakV && m.valleyV;
  return (
    <div className="flex flex-col gap-3" data-testid="measurement">
      <p className="text-sm" data-testid="waveform-kind">
        {ramp
          ? "Ramp: a slow charge and a fast discharge (a relaxation stage's capacitor), measured cycle by cycle."
          : "Pulse train: two state levels (IEEE Std 181-2011 histogram method)."}
      </p>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Measurement">
        <table className="table-dense">
          <thead>
            <tr>
              <th scope="col">Parameter</th>
              <th scope="col">Mean</th>
              <th scope="col">Std dev</th>
              <th scope="col">Min</th>
              <th scope="col">Max</th>
              <th scope="col">Count</th>
            </tr>
          </thead>
          {ramp ? (
            <tbody>
              <StatRow label="Period (trip to trip)" s={m.periodS} />
              <StatRow label="Charge time (release to trip)" s={m.lowS} />
              <StatRow label="Discharge time (output pulse)" s={m.highS} />
              <StatRow label="Trip voltage (peak)" s={m.peakV!} unit="V" />
              <StatRow label="Release voltage (valley)" s={m.valleyV!} unit="V" />
            </tbody>
          ) : (
            <tbody>
              <StatRow label="Period" s={m.periodS} />
              <StatRow label="High time (pulse duration)" s={m.highS} />
              <StatRow label="Low time" s={m.lowS} />
              <StatRow label="Rise time 10-90 %" s={m.riseTimes} />
              <StatRow label="Fall time 90-10 %" s={m.fallTimes} />
            </tbody>
          )}
        </table>
      </div>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
        <dt className="text-ink-soft">Duty</dt>
        <dd className="num">{formatEng(m.duty, "%", 4)}</dd>
        <dt className="text-ink-soft">Frequency</dt>
        <dd className="num">{formatEng(m.frequencyHz, "Hz", 6)}</dd>
        <dt className="text-ink-soft">{ramp ? "Release (mean)" : "Low state"}</dt>
        <dd className="num">{formatEng(m.lowLevelV, "V", 4)}</dd>
        <dt className="text-ink-soft">{ramp ? "Trip (mean)" : "High state"}</dt>
        <dd className="num">{formatEng(m.highLevelV, "V", 4)}</dd>
        <dt className="text-ink-soft">Samples</dt>
        <dd className="num">{m.samples.toLocaleString("en")}</dd>
        <dt className="text-ink-soft">Sample interval</dt>
        <dd className="num">{formatEng(m.sampleIntervalS, "s", 4)}</dd>
        <dt className="text-ink-soft">Record</dt>
        <dd className="num">{formatEng(m.durationS, "s", 4)}</dd>
        <dt className="text-ink-soft">Edges</dt>
        <dd className="num">{m.edgesTotal}</dd>
      </dl>
      <ScalingNote m={m} />
      {ramp && <StandoffEstimate peakV={m.peakV!.mean} />}
      {m.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-ink-soft" aria-label="Measurement warnings">
          {m.warnings.map((w) => (
            <li key={w.code}>{w.message}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
