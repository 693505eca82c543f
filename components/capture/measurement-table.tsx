// The measurement of a capture (IEEE Std 181-2011 terms): state levels, and
// mean, standard deviation, min, max and count of each timing parameter.
import { formatEng } from "@/lib/engine";
import type { CaptureStats } from "@/lib/capture";
import type { MeasurementSummary } from "@/lib/field/shapes";

function StatRow({ label, s, unit = "s" }: { label: string; s: CaptureStats; unit?: "s" }) {
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
  return (
    <div className="flex flex-col gap-3" data-testid="measurement">
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
          <tbody>
            <StatRow label="Period" s={m.periodS} />
            <StatRow label="High time (pulse duration)" s={m.highS} />
            <StatRow label="Low time" s={m.lowS} />
            <StatRow label="Rise time 10-90 %" s={m.riseTimes} />
            <StatRow label="Fall time 90-10 %" s={m.fallTimes} />
          </tbody>
        </table>
      </div>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
        <dt className="text-ink-soft">Duty</dt>
        <dd className="num">{formatEng(m.duty, "%", 4)}</dd>
        <dt className="text-ink-soft">Frequency</dt>
        <dd className="num">{formatEng(m.frequencyHz, "Hz", 6)}</dd>
        <dt className="text-ink-soft">Low state</dt>
        <dd className="num">{formatEng(m.lowLevelV, "V", 4)}</dd>
        <dt className="text-ink-soft">High state</dt>
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
