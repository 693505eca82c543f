// A stored revision of the NE555 astable (TI SLFS022, "Astable operation":
// t_H = ln 2 (RA + RB) C, t_L = ln 2 RB C) with RA 1 kΩ, C 1 µF and the given
// RB, planned by the engine for the ATmega328P's Timer1 in fast PWM at 16 MHz:
// the shape of revisions.plans (lib/revisions/types.ts StoredPlan). Shared by
// the comparison tests.
import { analyzeStage, planTarget } from "@/lib/engine";

export function astableSnapshot(rb: number) {
  const stage = { kind: "timer555-astable" as const, supplyV: 12, ra: 1e3, rb, c: 1e-6 };
  const analysis = analyzeStage(stage);
  const plan = planTarget({
    device: "atmega328p",
    clockHz: 16e6,
    periodS: analysis.periodS,
    highS: analysis.highS,
    mode: "pwm",
  });
  const target = {
    device: "atmega328p",
    clockSource: "crystal",
    clockHz: 16e6,
    clockAccuracyPpm: null,
    mode: "pwm",
    timer: null,
    requiredTolerancePct: 2,
  };
  return { spec: { stage, targets: [] }, analysis, plans: [{ target, plan, budget: null }] };
}
