// Points for drawing a target's emulated pin output beside the planned
// waveform: both as steps on one time axis from the first rising edge the
// emulator saw (the plan is aligned there; before it the image was starting).
// Pure, shared by the chart and its test.

export interface TracePoints {
  t: number[];
  planned: number[];
  emulated: (number | null)[];
}

export type Edge = { t: number; level: 0 | 1 };

/** The level the last edge at or before t set; null before the first edge. */
export function levelAt(edges: readonly Edge[], t: number): 0 | 1 | null {
  let level: 0 | 1 | null = null;
  for (const e of edges) {
    if (e.t > t) break;
    level = e.level;
  }
  return level;
}

/** Planned pin level at t: high for highS from t0 + k * periodS. */
function plannedAt(t: number, t0: number, periodS: number, highS: number): 0 | 1 {
  const phase = (((t - t0) % periodS) + periodS) % periodS;
  return phase < highS ? 1 : 0;
}

/** Steps over `periods` planned periods from the first emulated rising edge (0 when none). */
export function traceOf(
  planned: { periodS: number; highS: number },
  edges: Edge[] | undefined,
  periods = 3,
): TracePoints {
  const list = edges ?? [];
  const t0 = list.find((e) => e.level === 1)?.t ?? 0;
  const end = t0 + periods * planned.periodS;
  const eps = planned.periodS * 1e-6;
  const corners = new Set<number>([t0, end]);
  for (let k = 0; k <= periods; k++) {
    corners.add(t0 + k * planned.periodS);
    corners.add(t0 + k * planned.periodS + planned.highS);
  }
  for (const e of list) if (e.t >= t0 && e.t <= end) corners.add(e.t);
  const times = [...corners].filter((t) => t >= t0 && t <= end).sort((a, b) => a - b);
  const t: number[] = [];
  for (const c of times) {
    if (c > t0) t.push(c - eps); // the level just before the corner: drawn as a step
    t.push(c);
  }
  return {
    t: t.map((x) => x - t0),
    planned: t.map((x) => plannedAt(x, t0, planned.periodS, planned.highS)),
    emulated: t.map((x) => (list.length === 0 ? null : levelAt(list, x))),
  };
}
