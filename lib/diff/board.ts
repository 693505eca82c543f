// What the board will do, old revision against new, per target: the period,
// high time and (triggered plans) delay the firmware produces, and the
// accuracy budget against the required tolerance. A reviewer of timer firmware
// reads this before any register or line of text. Differences are given in
// the unit people read (engineering notation) and relative to the old value.
import { formatEng, listDevices } from "@/lib/engine";
import type { RevisionSnapshot } from "./types";

export type BoardQuantity = {
  /** "periodS" | "highS" | "delayS" | "budgetPpm" */
  key: string;
  what: string;
  before: string;
  after: string;
  /** Signed difference, new minus old, with its unit; "" when a side is missing or nothing changed. */
  difference: string;
  changed: boolean;
};

export type BoardTarget = {
  /** 1-based position, as in the bundle folders and the numbers table. */
  position: number;
  device: string;
  /** The datasheet's device name ("ATmega328P"), or the id when unknown. */
  deviceName: string;
  quantities: BoardQuantity[];
  /** "meets" / "misses" per side; null when a side has no budget. */
  verdictBefore: "meets" | "misses" | null;
  verdictAfter: "meets" | "misses" | null;
};

const obj = (v: unknown): Record<string, unknown> =>
  v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {};
const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

type Side = {
  device: string;
  periodS: number | null;
  highS: number | null;
  delayS: number | null;
  budgetPpm: number | null;
  requiredPpm: number | null;
  verdict: "meets" | "misses" | null;
};

function sides(rev: Pick<RevisionSnapshot, "plans">): Side[] {
  const plans = Array.isArray(rev.plans) ? rev.plans : [];
  return plans.map((entry) => {
    const e = obj(entry);
    const plan = "plan" in e ? obj(e.plan) : e;
    const budget = obj(e.budget);
    const verdict = budget.verdict === "meets" || budget.verdict === "misses" ? budget.verdict : null;
    return {
      device: typeof plan.device === "string" ? plan.device : "",
      periodS: num(plan.periodS),
      highS: num(plan.highS),
      delayS: num(plan.delayS),
      budgetPpm: num(budget.totalPpm),
      requiredPpm: num(budget.requiredPpm),
      verdict,
    };
  });
}

/** Relative change in % or ppm, whichever reads without a long run of zeros. */
function relative(before: number, after: number): string {
  if (before === 0) return "";
  const r = (after - before) / before;
  const sign = r > 0 ? "+" : r < 0 ? "−" : "±";
  const a = Math.abs(r);
  return a >= 1e-3
    ? `${sign}${Number((a * 100).toPrecision(3))} %`
    : `${sign}${Number((a * 1e6).toPrecision(3))} ppm`;
}

function timeQuantity(key: string, what: string, b: number | null, a: number | null): BoardQuantity {
  const before = b === null ? "—" : formatEng(b, "s", 4);
  const after = a === null ? "—" : formatEng(a, "s", 4);
  const changed = b !== a;
  let difference = "";
  if (changed && b !== null && a !== null) {
    const d = a - b;
    difference = `${d > 0 ? "+" : "−"}${formatEng(Math.abs(d), "s", 4)} (${relative(b, a)})`;
  }
  return { key, what, before, after, difference, changed };
}

function budgetText(s: Side | undefined): string {
  if (!s || s.budgetPpm === null) return "—";
  const need = s.requiredPpm === null ? "" : ` of ${Number(s.requiredPpm.toPrecision(4))} ppm allowed`;
  return `${Number(s.budgetPpm.toPrecision(4))} ppm${need}`;
}

/** Per target (by position), the board's timing old vs new. */
export function boardChanges(
  a: Pick<RevisionSnapshot, "plans">,
  b: Pick<RevisionSnapshot, "plans">,
): BoardTarget[] {
  const before = sides(a);
  const after = sides(b);
  const n = Math.max(before.length, after.length);
  const out: BoardTarget[] = [];
  for (let i = 0; i < n; i++) {
    const o = before[i];
    const w = after[i];
    const quantities = [
      timeQuantity("periodS", "Period", o?.periodS ?? null, w?.periodS ?? null),
      timeQuantity("highS", "High time", o?.highS ?? null, w?.highS ?? null),
    ];
    if ((o?.delayS ?? null) !== null || (w?.delayS ?? null) !== null)
      quantities.push(
        timeQuantity("delayS", "Delay from the input edge", o?.delayS ?? null, w?.delayS ?? null),
      );
    const ob = o?.budgetPpm ?? null;
    const wb = w?.budgetPpm ?? null;
    quantities.push({
      key: "budgetPpm",
      what: "Accuracy budget (worst case)",
      before: budgetText(o),
      after: budgetText(w),
      difference:
        ob !== null && wb !== null && ob !== wb
          ? `${wb > ob ? "+" : "−"}${Number(Math.abs(wb - ob).toPrecision(4))} ppm`
          : "",
      changed: ob !== wb,
    });
    const device = w?.device || o?.device || "";
    out.push({
      position: i + 1,
      device,
      deviceName: listDevices().find((d) => d.id === device)?.name ?? device,
      quantities,
      verdictBefore: o?.verdict ?? null,
      verdictAfter: w?.verdict ?? null,
    });
  }
  return out;
}
