// The budget verdict of one plan, in red with the reasons when it misses:
// the tolerance (total against required) and the gate-drive needs. Used by
// the workspace's plans table and the revision page, so both say the same.
import type { AccuracyBudget } from "@/lib/engine";
import { fmtPpm } from "./format";

type Budget = Pick<AccuracyBudget, "meetsTolerance" | "requiredPpm" | "totalPpm" | "dominant"> &
  Partial<Pick<AccuracyBudget, "verdict" | "gate">>;

/** "meets" | "misses" (stored plans from before the gate verdict lack `verdict`) and the reasons for a miss. */
export function verdictOf(b: Budget): { verdict: "meets" | "misses"; reasons: string[] } {
  const gateOk = b.gate ? b.gate.ok : true;
  const verdict = b.verdict ?? (b.meetsTolerance && gateOk ? "meets" : "misses");
  const reasons: string[] = [];
  if (!b.meetsTolerance)
    reasons.push(
      `Total ${fmtPpm(b.totalPpm)} is over the required ${fmtPpm(b.requiredPpm)} (largest part: ${b.dominant}).`,
    );
  if (b.gate && !b.gate.ok) reasons.push(...b.gate.findings);
  return { verdict, reasons };
}

export function BudgetVerdict({ budget }: { budget: Budget }) {
  const { verdict, reasons } = verdictOf(budget);
  if (verdict === "meets")
    return (
      <span className="text-ok" data-testid="budget-verdict" data-verdict="meets">
        meets {fmtPpm(budget.requiredPpm)}: total {fmtPpm(budget.totalPpm)}
        {budget.gate ? "; gate pulse within its needs" : ""}
      </span>
    );
  return (
    <div className="font-semibold text-hazard" data-testid="budget-verdict" data-verdict="misses">
      misses{budget.meetsTolerance ? " the gate-drive needs" : ` ${fmtPpm(budget.requiredPpm)}`}
      <ul className="list-disc pl-4 font-sans text-xs font-normal">
        {reasons.map((r, i) => (
          <li key={i}>{r}</li>
        ))}
      </ul>
    </div>
  );
}
