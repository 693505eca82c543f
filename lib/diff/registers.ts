// The register values each target's firmware writes, old revision against
// new, with the formula each value comes from. The values are taken from the
// bundle's own device views (lib/bundle/devices.ts) run on the stored plans,
// the same functions whose `writes` the templates print into main.c, so the
// table cannot show a number the firmware does not write.
import { TRIM_DEVICES } from "@/lib/bundle/trim-control";
import { DEVICES } from "@/lib/bundle/devices";
import { TRIGGER_VIEWS } from "@/lib/bundle/build";
import { avrTriggerView } from "@/lib/bundle/trigger-avr";
import { msp430g2553TriggerView } from "@/lib/bundle/trigger-msp430g2553";
import { pic12f1840TriggerView } from "@/lib/bundle/trigger-pic12f1840";
import type { RegisterWrite } from "@/lib/bundle/device-view";
import { controlOnTarget } from "@/lib/bundle/adc-control";
import type { BundlePlan, BundleSpec } from "@/lib/bundle/types";
import type { RevisionSnapshot } from "./types";

export type RegisterRow = {
  /** Register name as the datasheet spells it; a repeated write gets "#2", "#3". */
  reg: string;
  before: number | null;
  after: number | null;
  /** C expression in the vendor's bit names on the newer side (older when gone). */
  expr: string;
  /** The formula and its inputs, as the firmware's comment gives it. */
  why: string;
  changed: boolean;
};

export type RegisterTarget = {
  position: number;
  device: string;
  deviceName: string;
  rows: RegisterRow[];
  /** Set when a side's plan could not be turned into register writes. */
  note: string | null;
};

const obj = (v: unknown): Record<string, unknown> =>
  v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {};

/** Devices whose triggered firmware is the AVR one tabled below: those whose
 *  trigger view in generation (TRIGGER_VIEWS, lib/bundle/build.ts) is avrTriggerView. */
const AVR_TRIGGER_DEVICES = new Set(
  Object.entries(TRIGGER_VIEWS)
    .filter(([, view]) => view === avrTriggerView)
    .map(([device]) => device),
);

function planOf(entry: unknown): BundlePlan | null {
  const e = obj(entry);
  const plan = "plan" in e ? obj(e.plan) : e;
  return typeof plan.device === "string" ? (plan as unknown as BundlePlan) : null;
}

/** The writes of one plan in code order. A triggered AVR plan runs the
 *  triggered firmware (lib/bundle/trigger-avr.ts) instead of the free-running
 *  writes, so its rows are the ones that program writes. */
export function registerWrites(plan: BundlePlan): RegisterWrite[] {
  const entry = DEVICES[plan.device];
  if (!entry) throw new Error(`no register view for ${plan.device}`);
  const triggered = plan.start !== undefined && plan.start !== "free";
  // PIC12F1840 and MSP430G2553: the set-up writes of their triggered firmware (the handlers then only start and stop the timer)
  if (triggered && plan.device === "pic12f1840")
    return pic12f1840TriggerView(plan)!.steps.flatMap((s) => (s.write ? [s.write] : []));
  if (triggered && plan.device === "msp430g2553") return [...msp430g2553TriggerView(plan)!.writes];
  if (triggered && !AVR_TRIGGER_DEVICES.has(plan.device))
    throw new Error(
      `the triggered ${entry.name} firmware's registers are not tabled here yet: read its src/main.c in the files below`,
    );
  const trig = triggered ? avrTriggerView(plan) : null;
  if (!trig) return [...entry.view(plan).writes];
  return [
    { reg: trig.ctrlOther, value: 0, expr: "0", why: "normal counting, pins not driven by the timer" },
    {
      reg: trig.ocrA,
      value: trig.delayCounts,
      expr: `${trig.delayCounts}u`,
      why: `pulse on at delayCounts = delay * F_CPU / N = ${trig.delayCounts} counts (N = ${plan.divider}) after the input edge`,
    },
    {
      reg: trig.ocrB,
      value: trig.offCount,
      expr: `${trig.offCount}u`,
      why: `pulse off at delayCounts + highCounts = ${trig.delayCounts} + ${plan.highCounts}`,
    },
    { reg: trig.edgeReg, value: trig.edgeValue, expr: trig.edgeBits, why: `input edge: ${trig.edgeWords}` },
    {
      reg: trig.ctrl,
      value: trig.csValue,
      expr: String(trig.csValue),
      why: `clock select for N = ${plan.divider}, written by the input interrupt to start the count (0 while idle)`,
    },
  ];
}

/** A note when the firmware rewrites the registers while running (a kept rate pot's step table). */
function runtimeNote(rev: Partial<Pick<RevisionSnapshot, "spec">>, i: number): string | null {
  const spec = obj(rev.spec) as unknown as BundleSpec;
  const request = Array.isArray(spec.targets) ? spec.targets[i] : undefined;
  if (!spec.control || !request) return null;
  if (spec.control.kind === "trimmer" && TRIM_DEVICES.has(request.device))
    return "TOP and compare follow the trimmer's calibration constant TRIM_PERIOD_COUNTS (src/timing.h), set on site; shown are the values of the stored setting";
  try {
    const on = controlOnTarget(spec, request, i);
    if (!on?.kept) return null;
    return on.control.summary.kind === "selector"
      ? "the selector switch firmware writes TOP and compare from its position table while running (plan.json control); shown are the values of the fixed plan"
      : "the rate pot's ADC firmware writes TOP and compare from its step table while running (plan.json control); shown are the values of the fixed plan";
  } catch {
    return null;
  }
}

type Side = { writes: Map<string, RegisterWrite>; order: string[]; device: string; error: string | null };

function side(entry: unknown): Side | null {
  const plan = planOf(entry);
  if (!plan) return null;
  const writes = new Map<string, RegisterWrite>();
  const order: string[] = [];
  try {
    const seen = new Map<string, number>();
    for (const w of registerWrites(plan)) {
      const n = (seen.get(w.reg) ?? 0) + 1;
      seen.set(w.reg, n);
      const key = n === 1 ? w.reg : `${w.reg} #${n}`;
      writes.set(key, w);
      order.push(key);
    }
    return { writes, order, device: plan.device, error: null };
  } catch (e) {
    return { writes, order, device: plan.device, error: e instanceof Error ? e.message : String(e) };
  }
}

/** Per target (by position), every register the firmware writes, old vs new. */
export function registerChanges(
  a: Pick<RevisionSnapshot, "plans"> & Partial<Pick<RevisionSnapshot, "spec">>,
  b: Pick<RevisionSnapshot, "plans"> & Partial<Pick<RevisionSnapshot, "spec">>,
): RegisterTarget[] {
  const before = (Array.isArray(a.plans) ? a.plans : []).map(side);
  const after = (Array.isArray(b.plans) ? b.plans : []).map(side);
  const out: RegisterTarget[] = [];
  for (let i = 0; i < Math.max(before.length, after.length); i++) {
    const o = before[i] ?? null;
    const w = after[i] ?? null;
    // A target that moved to another device shares no register with its old self.
    const sameDevice = o && w && o.device === w.device;
    const old = sameDevice || !w ? o : null;
    const keys = [...(w?.order ?? []), ...(old?.order ?? []).filter((k) => !w?.writes.has(k))];
    const rows = keys.map((reg): RegisterRow => {
      const ow = old?.writes.get(reg);
      const nw = w?.writes.get(reg);
      const shown = nw ?? ow!;
      return {
        reg,
        before: ow?.value ?? null,
        after: nw?.value ?? null,
        expr: shown.expr,
        why: shown.why,
        changed: (ow?.value ?? null) !== (nw?.value ?? null),
      };
    });
    const device = w?.device ?? o?.device ?? "";
    const errors = [o?.error && `older: ${o.error}`, w?.error && `newer: ${w.error}`].filter(Boolean);
    const runtime = runtimeNote(b, i);
    if (runtime) errors.push(runtime);
    if (o && w && !sameDevice)
      errors.unshift(`moved from ${DEVICES[o.device]?.name ?? o.device}, whose registers do not compare`);
    out.push({
      position: i + 1,
      device,
      deviceName: DEVICES[device]?.name ?? device,
      rows,
      note: errors.length ? errors.join("; ") : null,
    });
  }
  return out;
}
