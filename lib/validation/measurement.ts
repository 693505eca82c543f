// Bounds on measured times (a measured stage, a field check, a capture used
// as a stage). They follow from the devices, not from taste: no plan on any
// device makes a period shorter than SHORTEST_PERIOD_S (two clock cycles at
// the fastest clock) or longer than LONGEST_PERIOD_S (the longest count at the
// slowest clock), and no time shorter than one clock cycle of the fastest
// clock (SHORTEST_TIME_S) can be planned. A measurement outside them is a
// slip (5e-324 s, a period in years) and is refused with the bounds stated.
import { formatEng, LONGEST_PERIOD_S, SHORTEST_PERIOD_S, SHORTEST_TIME_S } from "@/lib/engine";

export const MEASUREMENT_BOUNDS = {
  shortestPeriodS: SHORTEST_PERIOD_S,
  longestPeriodS: LONGEST_PERIOD_S,
  shortestHighS: SHORTEST_TIME_S,
} as const;

const f = (s: number) => formatEng(s, "s", 3);
// A Julian year of 365.25 days (IAU), only to make the longest bound readable.
const YEARS = Math.round(LONGEST_PERIOD_S / (365.25 * 86400));

/** Why a measured period cannot be planned, or null. */
export function periodOutOfBounds(periodS: number, label = "Period"): string | null {
  if (!Number.isFinite(periodS)) return `${label} must be a finite time.`;
  if (periodS < SHORTEST_PERIOD_S || periodS > LONGEST_PERIOD_S)
    return `${label} ${f(periodS)} is outside what any target device can make: from ${f(SHORTEST_PERIOD_S)} (two clock cycles at the fastest clock) to ${f(LONGEST_PERIOD_S)} (the longest count at the slowest clock, about ${YEARS} years).`;
  return null;
}

/** Why a measured high time cannot be planned, or null. */
export function highOutOfBounds(highS: number, label = "High time"): string | null {
  if (!Number.isFinite(highS)) return `${label} must be a finite time.`;
  if (highS < SHORTEST_TIME_S || highS > LONGEST_PERIOD_S)
    return `${label} ${f(highS)} is outside what any target device can make: from ${f(SHORTEST_TIME_S)} (one clock cycle at the fastest clock) to ${f(LONGEST_PERIOD_S)}.`;
  return null;
}

/** Every bound a measured period and high time break, keyed by the given field names. */
export function measurementProblems(
  m: { periodS?: number; highS?: number },
  names: { periodS: string; highS: string } = { periodS: "periodS", highS: "highS" },
  labels: { periodS: string; highS: string } = { periodS: "Period", highS: "High time" },
): Record<string, string> {
  const out: Record<string, string> = {};
  const p = m.periodS === undefined ? null : periodOutOfBounds(m.periodS, labels.periodS);
  const h = m.highS === undefined ? null : highOutOfBounds(m.highS, labels.highS);
  if (p) out[names.periodS] = p;
  if (h) out[names.highS] = h;
  if (!p && !h && m.periodS !== undefined && m.highS !== undefined && !(m.highS < m.periodS))
    out[names.highS] = `${labels.highS} ${f(m.highS)} must be shorter than the period ${f(m.periodS)}.`;
  return out;
}
