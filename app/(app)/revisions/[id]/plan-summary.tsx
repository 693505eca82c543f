// The plans a revision froze, one row per target.
import { BudgetVerdict } from "@/components/retrofit/budget-verdict";
import { formatEng, formatPpm } from "@/lib/engine";
import type { StoredPlan } from "@/lib/revisions/types";
import { deviceName } from "@/components/retrofit/format";

const ppm = (v: number) => formatPpm(v, 3);

export function PlanSummary({ plans }: { plans: StoredPlan[] }) {
  return (
    <section aria-labelledby="plans-title" className="panel overflow-x-auto" tabIndex={0}>
      <h2 id="plans-title" className="mb-2 font-semibold">
        Plans
      </h2>
      <table className="table-dense">
        <thead>
          <tr>
            <th>#</th>
            <th>Device</th>
            <th>Clock</th>
            <th>Timer, mode</th>
            <th>Pin</th>
            <th>Period</th>
            <th>Error</th>
            <th>High time</th>
            <th>Budget</th>
          </tr>
        </thead>
        <tbody>
          {plans.map(({ plan, budget }, i) => (
            <tr key={i}>
              <td className="num">{i + 1}</td>
              <td>{deviceName(plan.device)}</td>
              <td className="num">
                {formatEng(plan.clockHz, "Hz", 6)} {plan.clockSource}
              </td>
              <td>
                {plan.timer}, {plan.mode}
              </td>
              <td className="num">
                {plan.pin.port} ({plan.pin.function})
              </td>
              <td className="num">{formatEng(plan.periodS, "s", 6)}</td>
              <td className="num">{ppm(plan.periodErrorPpm)}</td>
              <td className="num">{formatEng(plan.highS, "s", 6)}</td>
              <td>{budget ? <BudgetVerdict budget={budget} /> : "—"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
