// Tolerances as people write them. A number is relative, as the engine keeps
// it (0.05 = ±5 %); a string is in percent: "5", "5 %", or "-20/+80" for an
// asymmetric part such as an electrolytic capacitor (IEC 60062 letter codes
// are not accepted here; write the percentages).
import type { Tolerance } from "@/lib/engine";

const PCT = String.raw`\s*([0-9]+(?:\.[0-9]+)?)\s*%?\s*`;
const SYMMETRIC = new RegExp(`^[±]?${PCT}$`);
const PAIR = new RegExp(`^-${PCT}/\\s*\\+?${PCT}$|^${PCT}/\\s*\\+?${PCT}$`);

export function readTolerance(
  raw: unknown,
): { ok: true; value: Tolerance | undefined } | { ok: false; message: string } {
  if (raw === undefined || raw === null || raw === "") return { ok: true, value: undefined };
  if (typeof raw === "number") {
    return Number.isFinite(raw) && raw >= 0
      ? { ok: true, value: raw }
      : { ok: false, message: "A tolerance is a relative number >= 0 (0.05 = 5 %)." };
  }
  if (
    Array.isArray(raw) &&
    raw.length === 2 &&
    raw.every((x) => typeof x === "number" && Number.isFinite(x))
  ) {
    return { ok: true, value: [raw[0], raw[1]] as const };
  }
  if (typeof raw !== "string") return { ok: false, message: "Write a tolerance as 5 or -20/+80 (percent)." };
  const s = raw.trim();
  const sym = SYMMETRIC.exec(s);
  if (sym) return { ok: true, value: Number(sym[1]) / 100 };
  const pair = PAIR.exec(s);
  if (pair) {
    const minus = Number(pair[1] ?? pair[3]);
    const plus = Number(pair[2] ?? pair[4]);
    return { ok: true, value: [minus / 100, plus / 100] as const };
  }
  return { ok: false, message: `Cannot read "${s}" as a tolerance; write 5 (±5 %) or -20/+80.` };
}

/** The tolerance as the form shows it, in percent. */
export function formatTolerance(t: Tolerance | undefined): string {
  if (t === undefined) return "";
  const pct = (x: number) => String(Number((x * 100).toPrecision(4)));
  return typeof t === "number" ? pct(t) : `-${pct(t[0])}/+${pct(t[1])}`;
}
