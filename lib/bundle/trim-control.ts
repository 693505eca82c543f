// A kept trimmer in the bundle: the fixed firmware's TOP and compare writes
// take the calibration constant TRIM_PERIOD_COUNTS of src/timing.h
// (templates/common/trim-constant.h.hbs) instead of fixed numbers, and the
// checklist gets the steps that set it on site (measure, compute, write,
// rebuild and flash, measure again).
import { buildTrimRange, EngineError, isEngineError, type TrimRange } from "@/lib/engine";
import type { StageControl } from "@/lib/engine";
import { eng } from "./format";
import type { ControlCheckLine, KeptControl } from "./adc-control";
import type { DeviceView, RegisterWrite } from "./device-view";
import type { BundlePlan, BundleSpec } from "./types";

/**
 * Devices whose fixed firmware takes the constant: from src/timing.h (C images), or on the
 * PIC12F1840 from src/trim_constant.inc, one #define line both main.asm (gpasm) and timing.h
 * (XC8) include; its duty is in quarter counts (CCPR1L:DC1B, datasheet CCP PWM).
 */
const TRIM_FILES: Record<string, { file: string; highPerCount: number }> = {
  atmega328p: { file: "src/timing.h", highPerCount: 1 },
  attiny85: { file: "src/timing.h", highPerCount: 1 },
  rp2040: { file: "src/timing.h", highPerCount: 1 },
  stm32g031: { file: "src/timing.h", highPerCount: 1 },
  msp430g2553: { file: "src/timing.h", highPerCount: 1 },
  pic12f1840: { file: "src/trim_constant.inc", highPerCount: 4 },
};
export const TRIM_DEVICES = new Set(Object.keys(TRIM_FILES));

/** Registers that hold TOP (period counts - 1) and the compare value, per device view (device-*.ts). */
const TOP_REGS = new Set(["ICR1", "OCR0A", "OCR2A", "OCR1C", "TOP", "ARR", "TA0CCR0"]);
const COMPARE_REGS = new Set([
  "OCR1A",
  "OCR1B",
  "OCR0B",
  "OCR2B",
  "CC",
  "CCR1",
  "CCR2",
  "CCR3",
  "CCR4",
  "TA0CCR1",
  "TA0CCR2",
]);

export const TRIM_CONSTANT = "TRIM_PERIOD_COUNTS";

export interface TrimmerSummary {
  kind: "trimmer";
  field: string;
  constant: typeof TRIM_CONSTANT;
  file: string;
  countS: number;
  storedCounts: number;
  minCounts: number;
  maxCounts: number;
  highCounts: { min: number; stored: number; max: number };
}

/** PIC12F1840 Timer2/CCP1 writes: PR2 = N - 1; CCPR1L:DC1B = the quarter-count duty (datasheet CCP PWM). */
function picTrimWrite(plan: BundlePlan, w: RegisterWrite): RegisterWrite | null {
  const duty10 = Math.round(plan.highCounts * 4);
  if (w.reg === "PR2" && w.value === plan.periodCounts - 1)
    return { ...w, expr: "(TRIM_PERIOD_COUNTS - 1)", why: `${w.why} (the calibration constant)` };
  if (w.reg === "CCP1CON" && w.value === (((duty10 & 3) << 4) | 0x0c))
    return {
      ...w,
      expr: "(((TRIM_HIGH_COUNTS & 3) << 4) | 0x0C)",
      why: `${w.why} (DC1B follows the constant)`,
    };
  if (w.reg === "CCPR1L" && w.value === duty10 >> 2)
    return { ...w, expr: "(TRIM_HIGH_COUNTS >> 2)", why: `${w.why} (follows the calibration constant)` };
  return null;
}

/** The PIC12F1840 view's steps with PR2, CCP1CON and CCPR1L from the constant. */
export function trimPicExtra(plan: BundlePlan, extra: Record<string, unknown>): Record<string, unknown> {
  const steps = extra.steps as { write: RegisterWrite | null }[];
  let n = 0;
  const out = steps.map((st) => {
    const w = st.write ? picTrimWrite(plan, st.write) : null;
    if (!w) return st;
    n++;
    return { ...st, write: w };
  });
  if (n !== 3)
    throw new Error("pic12f1840: no PR2, CCP1CON and CCPR1L writes to take the trimmer's constant.");
  return { ...extra, steps: out };
}

/** The writes with TOP and compare as expressions of the constant; throws when the view has neither. */
export function trimWrites(plan: BundlePlan, writes: RegisterWrite[]): RegisterWrite[] {
  if (plan.device === "pic12f1840") return writes.map((w) => picTrimWrite(plan, w) ?? w);
  let top = 0;
  let compare = 0;
  const out = writes.map((w) => {
    if (TOP_REGS.has(w.reg) && w.value === plan.periodCounts - 1) {
      top++;
      return { ...w, expr: `(${TRIM_CONSTANT} - 1u)`, why: `${w.why} (the calibration constant)` };
    }
    if (COMPARE_REGS.has(w.reg)) {
      const h = plan.highCounts;
      const expr =
        w.value === h - 1
          ? "(TRIM_HIGH_COUNTS - 1u)"
          : w.value === h
            ? "TRIM_HIGH_COUNTS"
            : w.value === h << 16
              ? "(TRIM_HIGH_COUNTS << 16)"
              : null;
      if (expr) {
        compare++;
        return { ...w, expr, why: `${w.why} (follows the calibration constant)` };
      }
    }
    return w;
  });
  if (top !== 1 || compare !== 1)
    throw new Error(
      `${plan.device} ${plan.timer}: no single TOP and compare write to take the trimmer's constant.`,
    );
  return out;
}

export interface TrimOnTarget {
  kept: KeptControl;
  range: TrimRange;
  writes: RegisterWrite[];
  /** the device view's extra, with the PIC12F1840's steps rewritten */
  extra: Record<string, unknown>;
  controlText: string;
}

/** The trimmer on target `index` (a device of TRIM_DEVICES, pwm plan); errors name `targets.<index>`. */
export function trimOnTarget(
  spec: BundleSpec,
  plan: BundlePlan,
  writes: RegisterWrite[],
  index: number,
  viewOf: (p: BundlePlan) => DeviceView,
  extraIn: Record<string, unknown>,
): TrimOnTarget {
  const where = TRIM_FILES[plan.device];
  const c = spec.control as Extract<StageControl, { kind: "trimmer" }>;
  let range: TrimRange;
  let out: RegisterWrite[];
  let extra = extraIn;
  try {
    range = buildTrimRange(spec.stage, c, plan, where.highPerCount);
    out = trimWrites(plan, writes);
    if (plan.device === "pic12f1840") extra = trimPicExtra(plan, extraIn);
    // the longest end must fit the same timer set-up (the view checks every register's range)
    try {
      viewOf({
        ...plan,
        periodCounts: range.max.periodCounts,
        highCounts: range.max.highCounts / range.highPerCount,
      });
    } catch (e) {
      const why = e instanceof Error ? e.message : String(e);
      throw new EngineError(
        "invalid-request",
        `the trimmer's longest period (${eng(range.periodAtMaxS, "s")}) does not fit this timer set-up (${why}); store ${c.field} at the trimmer's long end, or choose a lower clock.`,
      );
    }
  } catch (e) {
    const why = e instanceof Error ? e.message : String(e);
    throw new EngineError(
      isEngineError(e) ? e.code : "invalid-request",
      `target ${index + 1} (${plan.device}) cannot keep the trimmer: ${why}`,
      `targets.${index}`,
    );
  }
  const countS = range.countS;
  const accuracy = (plan.clockAccuracyPpm ?? 50) * 1e-6;
  const widen = (v: number) => v * accuracy + (plan.jitterS ?? 0) + countS;
  const storedS = range.stored.periodCounts * countS;
  const lines: ControlCheckLine[] = [
    {
      instruction: `Before the old board comes out, measure its period as trimmed; it must lie between the trimmer's ends.`,
      expectedS: range.periodStoredS,
      minS: Math.min(range.periodAtMinS, range.periodAtMaxS),
      maxS: Math.max(range.periodAtMinS, range.periodAtMaxS),
    },
    {
      instruction: `Compute ${TRIM_CONSTANT} = measured period / ${eng(countS, "s")}, rounded to a whole number (${range.min.periodCounts}..${range.max.periodCounts}); write it in ${where.file}, rebuild and flash (README). The build refuses a value outside the range.`,
      expectedS: storedS,
      minS: range.min.periodCounts * countS,
      maxS: range.max.periodCounts * countS,
    },
    {
      instruction: `Measure the new board's period: ${TRIM_CONSTANT} × ${eng(countS, "s")}, within clock accuracy + jitter + one count. Expected and limits here are for the stored value (${range.stored.periodCounts}).`,
      expectedS: storedS,
      minS: storedS - widen(storedS),
      maxS: storedS + widen(storedS),
    },
  ];
  const controlText = `trimmer as ${c.field}, ${c.trackR} ohm track + ${c.seriesR} ohm in series`;
  return {
    range,
    writes: out,
    extra,
    controlText,
    kept: {
      table: { plan: plan as unknown as KeptControl["table"]["plan"] },
      count: 1,
      titles: {
        wiring: "",
        checks: `Trimmer calibration (the old board's trimmer, now the constant ${TRIM_CONSTANT})`,
        intro: `The new board has no trimmer: one count of ${TRIM_CONSTANT} is ${eng(countS, "s")} of period. Set it once, in this order.`,
      },
      files:
        where.file === "src/timing.h"
          ? []
          : [{ path: where.file, content: `#define ${TRIM_CONSTANT} ${range.stored.periodCounts}\n` }],
      wiring: [],
      lines,
      summary: {
        kind: "trimmer",
        field: c.field,
        constant: TRIM_CONSTANT,
        file: where.file,
        countS,
        storedCounts: range.stored.periodCounts,
        minCounts: range.min.periodCounts,
        maxCounts: range.max.periodCounts,
        highCounts: { min: range.min.highCounts, stored: range.stored.highCounts, max: range.max.highCounts },
      },
    },
  };
}
