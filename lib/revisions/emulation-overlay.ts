// Points for drawing two revisions' emulated pin outputs of one target on one
// time axis (the compare page): each trace starts at its own first rising edge
// (the images start up in different times; the timing after that is what the
// reviewer compares), and both are drawn as steps over `periods` of the longer
// period. Pure, shared by the chart and its test.

import { levelAt, type Edge } from "./emulation-trace";

export interface OverlayPoints {
  /** time from each trace's first rising edge, seconds */
  t: number[];
  older: (0 | 1 | null)[];
  newer: (0 | 1 | null)[];
}

/** Edges shifted so the first rising edge is at 0; edges before it (start-up) dropped. Null when it never rose. */
function fromFirstRise(edges: Edge[] | undefined): Edge[] | null {
  const list = edges ?? [];
  const rise = list.findIndex((e) => e.level === 1);
  if (rise < 0) return null;
  const t0 = list[rise].t;
  return list.slice(rise).map((e) => ({ t: e.t - t0, level: e.level }));
}

/** The level at t; null past the last stored edge (only the first edges are stored, so later is unknown). */
function storedLevelAt(edges: Edge[] | null, t: number): 0 | 1 | null {
  if (!edges || edges.length === 0 || t > edges[edges.length - 1].t) return null;
  return levelAt(edges, t);
}

/**
 * Both traces as steps on one axis. `spanS` is the drawn length (e.g. three of
 * the longer planned periods); every edge of either trace inside it is a corner,
 * and the level just before each corner is drawn too so the steps are square.
 */
export function overlayOf(
  older: Edge[] | undefined,
  newer: Edge[] | undefined,
  spanS: number,
): OverlayPoints {
  const a = fromFirstRise(older);
  const b = fromFirstRise(newer);
  const eps = spanS * 1e-7;
  const corners = new Set<number>([0, spanS]);
  for (const list of [a, b]) for (const e of list ?? []) if (e.t > 0 && e.t < spanS) corners.add(e.t);
  const t: number[] = [];
  for (const c of [...corners].sort((x, y) => x - y)) {
    if (c > 0) t.push(c - eps);
    t.push(c);
  }
  return { t, older: t.map((x) => storedLevelAt(a, x)), newer: t.map((x) => storedLevelAt(b, x)) };
}
