"use client";
// Plans of all targets side by side: one column per target, computed live by
// the engine's solver and accuracy budget in the browser.
import { formatEng } from "@/lib/engine";
import type { TargetPlanRow } from "@/lib/revisions/plan-targets";
import { plainMessage } from "@/lib/validation/plain-message";
import { deviceById } from "@/lib/validation/target";
import { BudgetVerdict } from "./budget-verdict";
import { fmtPpm, fmtS } from "./format";

type Cell = (r: Extract<TargetPlanRow, { ok: true }>) => React.ReactNode;

const ROWS: [string, Cell][] = [
  ["Device", (r) => deviceById(r.plan.device)?.name ?? r.plan.device],
  [
    "Clock",
    (r) =>
      `${formatEng(r.plan.clockHz, "Hz", 6)} (${r.plan.clockSource}, ±${fmtPpm(r.plan.clockAccuracyPpm)})`,
  ],
  [
    "Timer, mode",
    (r) =>
      `${r.plan.timer}, ${r.plan.mode}${r.plan.mode !== r.plan.requestedMode ? ` (asked ${r.plan.requestedMode})` : ""}`,
  ],
  [
    "Pin",
    (r) => `${r.plan.pin.port} (${r.plan.pin.function}), pin ${r.plan.pin.packagePin} ${r.plan.pin.package}`,
  ],
  ["Achieved period", (r) => fmtS(r.plan.periodS, 6)],
  ["Period error", (r) => fmtPpm(r.plan.periodErrorPpm)],
  ["Achieved high time", (r) => fmtS(r.plan.highS, 6)],
  ["High time error", (r) => fmtPpm(r.plan.highErrorPpm)],
  ["Resolution", (r) => `${r.plan.resolutionBits.toFixed(1)} bit (step ${fmtS(r.plan.highResolutionS, 3)})`],
  ["Jitter", (r) => fmtS(r.plan.jitterS, 3)],
  [
    "Accuracy budget",
    (r) =>
      r.budget ? (
        <BudgetVerdict budget={r.budget} />
      ) : (
        <span className="text-ink-muted">no tolerance set</span>
      ),
  ],
  [
    "Notes",
    (r) => {
      // The engine writes bare SI numbers ("0.0000167 s"); shown in engineering units.
      const notes = [...r.plan.notes, ...(r.budget?.notes.slice(1) ?? [])].map((n) => plainMessage(n));
      return notes.length ? (
        <ul className="list-disc pl-4 font-sans text-xs">
          {notes.map((n, i) => (
            <li key={i}>{n}</li>
          ))}
        </ul>
      ) : (
        "—"
      );
    },
  ],
];

export function PlansTable({ rows }: { rows: TargetPlanRow[] }) {
  if (rows.length === 0) return null;
  return (
    <section aria-labelledby="plans-title" className="panel">
      <h2 id="plans-title" className="mb-2 font-semibold">
        Plans
      </h2>
      <div className="overflow-x-auto">
        <table className="table-dense" data-testid="plans-table">
          <thead>
            <tr>
              <th scope="col">
                <span className="sr-only">Quantity</span>
              </th>
              {rows.map((r) => (
                <th key={r.index} scope="col">
                  Target {r.index + 1}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {ROWS.map(([label, cell], li) => (
              <tr key={label}>
                <th scope="row" className="whitespace-nowrap">
                  {label}
                </th>
                {rows.map((r) =>
                  r.ok ? (
                    <td key={r.index} className="num">
                      {cell(r)}
                    </td>
                  ) : li === 0 ? (
                    <td key={r.index} rowSpan={ROWS.length} className="text-hazard">
                      Cannot plan: {r.message}
                    </td>
                  ) : null,
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
