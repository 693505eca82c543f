// UJT relaxation oscillator (e.g. 2N2646): C charges through R until the
// emitter reaches the peak point Vp = eta*VBB + VD (+ the drop across R1),
// the emitter-base-1 junction fires and C discharges through R1 + rB1(on).
// Sources: General Electric SCR Manual, UJT chapter (load-line limits and the
// peak-point equation, from memory); Millman & Halkias, Integrated Electronics,
// UJT section (T ~= RC ln(1/(1 - eta)) when Vs >> VD, Vv; from memory).
import type { StageCheck, UjtStage } from "../stage-types";
import { relaxation, relaxationSegments, type RelaxationInput } from "./threshold";
import { NO_CHECKS, errorCheck, fmt, stopped, type ModelResult, type StageModel } from "./model";

export const UJT_DEFAULTS = {
  diodeV: 0.6,
  valleyV: 2.0,
  peakCurrentA: 5e-6,
  valleyCurrentA: 4e-3,
  base1R: 47,
  base2R: 470,
  /** on-state base-1 resistance added to R1 for the discharge path */
  base1OnR: 5,
};

/**
 * Peak-point voltage. With the interbase resistance known, the base divider
 * RBB, R1, R2 sets the voltage at the emitter's tap: VB1 + eta*VBB, where
 * VB1 = Vs*R1/(RBB + R1 + R2) is the drop across R1 (the emitter is measured
 * from ground, not from base 1). Without RBB: VBB = Vs and R1 is ignored.
 */
export function ujtPeakV(s: UjtStage): number {
  const vd = s.diodeV ?? UJT_DEFAULTS.diodeV;
  if (s.interbaseR === undefined) return s.eta * s.supplyV + vd;
  const r1 = s.base1R ?? UJT_DEFAULTS.base1R;
  const r2 = s.base2R ?? UJT_DEFAULTS.base2R;
  const total = s.interbaseR + r1 + r2;
  const vbb = (s.supplyV * s.interbaseR) / total;
  return (s.supplyV * r1) / total + s.eta * vbb + vd;
}

/**
 * Load line through the negative-resistance region (GE SCR Manual, UJT
 * chapter, from memory): (Vs - Vv)/Iv < R < (Vs - Vp)/Ip. Below: the supply
 * holds the device on past the valley (latch-up); above: too little current
 * reaches the emitter to fire at the peak point.
 */
export function loadLineChecks(
  x: { supplyV: number; r: number; peakV: number; valleyV: number; peakA: number; valleyA: number },
  device: string,
): readonly StageCheck[] {
  const rMin = (x.supplyV - x.valleyV) / x.valleyA;
  const rMax = (x.supplyV - x.peakV) / x.peakA;
  if (x.r > rMin && x.r < rMax) return NO_CHECKS;
  // Messages are built only on failure: this runs for every Monte Carlo sample.
  const range = `${fmt(rMin, "Ω")} to ${fmt(rMax, "Ω")}`;
  if (x.r <= rMin) {
    return [
      errorCheck(
        "load-line-latch",
        `Timing resistor ${fmt(x.r, "Ω")} passes at least the valley current (${fmt(x.valleyA, "A")}) at the valley point: the ${device} latches on after the first pulse. Use a timing resistor from ${range}.`,
        "timingR",
      ),
    ];
  }
  return [
    errorCheck(
      "load-line-no-fire",
      `Timing resistor ${fmt(x.r, "Ω")} cannot supply the peak-point current (${fmt(x.peakA, "A")}) at the trip voltage: the ${device} never fires. Use a timing resistor from ${range}.`,
      "timingR",
    ),
  ];
}

/**
 * A negative-resistance stage (UJT, PUT): the load-line condition first, then
 * the generic relaxation timing. Thresholds out of order are left to
 * relaxation(), which explains them.
 */
export function negativeResistanceStage(
  x: RelaxationInput,
  currents: { peakA: number; valleyA: number },
  device: string,
  fields: Parameters<typeof relaxation>[1],
): ModelResult {
  if (x.supplyV > x.peakV && x.peakV > x.valleyV) {
    const line = loadLineChecks({ ...x, ...currents }, device);
    if (line.length) return stopped(line);
  }
  return relaxation(x, fields);
}

export function ujtInput(s: UjtStage): RelaxationInput {
  return {
    supplyV: s.supplyV,
    r: s.timingR,
    c: s.timingC,
    peakV: ujtPeakV(s),
    valleyV: s.valleyV ?? UJT_DEFAULTS.valleyV,
    dischargeR: (s.base1R ?? UJT_DEFAULTS.base1R) + UJT_DEFAULTS.base1OnR,
  };
}

const FIELDS = { supply: "supplyV", r: "timingR", peak: "eta", valley: "valleyV", discharge: "base1R" };

function evaluate(s: UjtStage): ModelResult {
  return negativeResistanceStage(
    ujtInput(s),
    {
      peakA: s.peakCurrentA ?? UJT_DEFAULTS.peakCurrentA,
      valleyA: s.valleyCurrentA ?? UJT_DEFAULTS.valleyCurrentA,
    },
    "UJT",
    FIELDS,
  );
}

export const ujtModel: StageModel<UjtStage> = {
  kind: "ujt",
  label: "UJT relaxation oscillator",
  outputSignal: "pulse-base1",
  outputLabel: "Short positive pulse across R1 (base 1), e.g. to a thyristor gate",
  fields: [
    { name: "supplyV", label: "Supply voltage", unit: "V", optional: false, range: "positive" },
    { name: "timingR", label: "Timing resistor", unit: "Ω", optional: false, range: "positive" },
    { name: "timingC", label: "Timing capacitor", unit: "F", optional: false, range: "positive" },
    { name: "eta", label: "Intrinsic standoff ratio η", unit: "", optional: false, range: "fraction" },
    {
      name: "diodeV",
      label: "Emitter diode drop",
      unit: "V",
      optional: true,
      default: UJT_DEFAULTS.diodeV,
      range: "nonNegative",
    },
    {
      name: "valleyV",
      label: "Valley voltage",
      unit: "V",
      optional: true,
      default: UJT_DEFAULTS.valleyV,
      range: "nonNegative",
    },
    {
      name: "peakCurrentA",
      label: "Peak-point current",
      unit: "A",
      optional: true,
      default: UJT_DEFAULTS.peakCurrentA,
      range: "positive",
    },
    {
      name: "valleyCurrentA",
      label: "Valley current",
      unit: "A",
      optional: true,
      default: UJT_DEFAULTS.valleyCurrentA,
      range: "positive",
    },
    {
      name: "interbaseR",
      label: "Interbase resistance RBB",
      unit: "Ω",
      optional: true,
      defaultText: "not used: VBB = supply",
      range: "positive",
    },
    {
      name: "base1R",
      label: "Base-1 resistor R1",
      unit: "Ω",
      optional: true,
      default: UJT_DEFAULTS.base1R,
      range: "nonNegative",
    },
    {
      name: "base2R",
      label: "Base-2 resistor R2",
      unit: "Ω",
      optional: true,
      default: UJT_DEFAULTS.base2R,
      range: "nonNegative",
    },
  ],
  evaluate,
  segments: (s, r) => ({ unit: "V", segments: relaxationSegments(ujtInput(s), r) }),
};
