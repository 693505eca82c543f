// 555 astable: C charges through Ra + Rb from Vctl/2 to Vctl (output high),
// discharges through Rb to Vctl/2 (output low); Vctl = 2/3 Vcc unless the
// control pin is driven. Source: Texas Instruments NE555 datasheet (SLFS022),
// astable operation: tH = 0.693 (RA + RB) C, tL = 0.693 RB C,
// f = 1.44 / ((RA + 2 RB) C). A diode across Rb makes the charge path Ra
// alone, toward Vcc - VD (same datasheet family's duty-cycle note).
import type { Timer555AstableStage } from "../stage-types";
import { errorCheck, fmt, running, stopped, warningCheck, type ModelResult, type StageModel } from "./model";

export const TIMER555_DIODE_V = 0.7;

function levels(s: Timer555AstableStage) {
  const vctl = s.controlV ?? (2 / 3) * s.supplyV;
  const chargeToward = s.diodeAcrossRb ? s.supplyV - TIMER555_DIODE_V : s.supplyV;
  const chargeR = s.diodeAcrossRb ? s.ra : s.ra + s.rb;
  return { vctl, chargeToward, chargeR };
}

function evaluate(s: Timer555AstableStage): ModelResult {
  const { vctl, chargeToward, chargeR } = levels(s);
  if (chargeToward <= vctl) {
    return stopped([
      errorCheck(
        "supply-below-trip",
        `The capacitor charges toward ${fmt(chargeToward, "V")}, which does not exceed the upper threshold ${fmt(vctl, "V")} (control pin): the output never goes low. Lower the control voltage or raise the supply.`,
        s.controlV !== undefined ? "controlV" : "supplyV",
      ),
    ]);
  }
  const highS = chargeR * s.c * Math.log((chargeToward - vctl / 2) / (chargeToward - vctl));
  const lowS = s.rb * s.c * Math.LN2;
  return running(highS, lowS);
}

export const timer555AstableModel: StageModel<Timer555AstableStage> = {
  kind: "timer555-astable",
  label: "555 astable",
  outputSignal: "rect-output",
  outputLabel: "Rectangular output (pin 3), high while the capacitor charges",
  fields: [
    { name: "supplyV", label: "Supply voltage", unit: "V", optional: false, range: "positive" },
    { name: "ra", label: "RA (VCC to discharge)", unit: "Ω", optional: false, range: "positive" },
    { name: "rb", label: "RB (discharge to threshold)", unit: "Ω", optional: false, range: "positive" },
    { name: "c", label: "Timing capacitor", unit: "F", optional: false, range: "positive" },
    {
      name: "controlV",
      label: "Control voltage (pin 5)",
      unit: "V",
      optional: true,
      defaultText: "2/3 of the supply",
      range: "positive",
    },
    {
      name: "diodeAcrossRb",
      label: "Diode across RB",
      unit: "bool",
      optional: true,
      default: false,
      range: "bool",
    },
  ],
  evaluate,
  warnings(s) {
    // TI SLFS022 recommended operating conditions: VCC 4.5 V to 16 V (from memory).
    if (s.supplyV < 4.5 || s.supplyV > 16) {
      return [
        warningCheck(
          "supply-range",
          `Supply ${fmt(s.supplyV, "V")} is outside the bipolar NE555's 4.5 V to 16 V; check that the fitted part (e.g. a CMOS 555) is rated for it.`,
          "supplyV",
        ),
      ];
    }
    return [];
  },
  segments(s, r) {
    const { vctl, chargeToward, chargeR } = levels(s);
    return {
      unit: "V",
      segments: [
        { from: vctl / 2, toward: chargeToward, tauS: chargeR * s.c, durationS: r.highS, out: 1 },
        { from: vctl, toward: 0, tauS: s.rb * s.c, durationS: r.lowS, out: 0 },
      ],
    };
  },
};
