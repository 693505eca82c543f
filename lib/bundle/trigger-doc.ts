// Pin-map and checklist lines for triggered and zero-cross plans (engine.md
// section 6): the input pin with its conditioning, and the delay limit with
// the stated latency. Delay limit: achieved delay - one count (the prescaler
// phase can shorten the first count) ... achieved delay + one count + the
// worst-case latency, widened by the clock accuracy; the delay is measured
// from the input edge to the output pulse's leading edge.
import { limitBasis } from "./limits";
import type { BundlePlan } from "./types";

export interface TriggerDoc {
  zeroCross: boolean;
  inputPort: string;
  inputFunction: string;
  inputPackagePin: number;
  inputPackage: string;
  edge: string;
  edgeSetting: string;
  conditioning: string;
  retrigger: string;
  delayS: number;
  delayMinS: number;
  delayMaxS: number;
  latencyS: number;
  latencyCycles: number;
  latencyBasis: string;
}

export function triggerDoc(plan: BundlePlan): TriggerDoc | null {
  if (plan.start === undefined || plan.start === "free" || !plan.input) return null;
  const b = limitBasis(plan);
  const delayS = plan.delayS ?? 0;
  const latencyS = plan.latencyS ?? 0;
  const clock = delayS * b.clockAccuracyPpm * 1e-6;
  return {
    zeroCross: plan.start === "zero-cross",
    inputPort: plan.input.port,
    inputFunction: plan.input.function,
    inputPackagePin: Number(plan.input.packagePin),
    inputPackage: plan.input.package ?? "",
    edge: plan.edge ?? "",
    edgeSetting: plan.edgeSetting ?? "",
    conditioning: plan.inputConditioning ?? "",
    retrigger:
      plan.start === "zero-cross"
        ? "one pulse per zero crossing"
        : plan.retrigger === "restart"
          ? "a trigger during the delay or pulse starts the delay again (the pulse is cut short)"
          : "a trigger during the delay or pulse is ignored",
    delayS,
    delayMinS: Math.max(0, delayS - b.countS - clock),
    delayMaxS: delayS + b.countS + latencyS + clock,
    latencyS,
    latencyCycles: plan.latencyCycles ?? 0,
    latencyBasis: plan.latencyBasis ?? "",
  };
}
