// The stored multi-resolution form of a capture (table capture_levels), made
// once at upload, so a zoomed plot reads only the window it shows and never
// parses the file again.
//  - Level 0 holds the samples: (t, v) float64 pairs.
//  - Level k >= 1 holds one entry per CAPTURE_FAN^k samples, aligned at
//    multiples of CAPTURE_FAN^k: (t of its first sample, min v, max v).
//  - Each level is cut into blocks of CAPTURE_BLOCK entries; a block row keeps
//    its first entry's index and its first and last entry's time.
// Levels are added until one has at most MAX_WINDOW_ENTRIES entries, so every
// window can be drawn from at most MAX_WINDOW_ENTRIES entries of one level.
// Reading a window: the two level-0 blocks holding its ends give the exact
// sample range (one sample beyond each end, so the ends are drawn); then the
// finest level with at most MAX_WINDOW_ENTRIES entries over that range is
// read, block by block, and folded into at most PLOT_POINTS points of whole
// entries. Work and memory per request are bounded by
// (MAX_WINDOW_ENTRIES + 4 * CAPTURE_BLOCK) entries whatever the capture's size.
// Floats are stored in the host's byte order (little-endian on every host we run on).
// No "server-only" mark: the benchmark (scripts/bench/capture-plot.ts) runs it too.
import { and, asc, eq, gte, lte, sql } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { captureLevels } from "@/db/schema";
import { PLOT_POINTS, type PlotPoint } from "@/lib/capture";

export const CAPTURE_FAN = 8;
export const CAPTURE_BLOCK = 4096;
export const MAX_WINDOW_ENTRIES = PLOT_POINTS * CAPTURE_FAN;

type LevelRow = typeof captureLevels.$inferInsert;

function f64(buf: Buffer): Float64Array {
  // A copy: pg's Buffer need not be 8-byte aligned.
  const copy = new ArrayBuffer(buf.length);
  new Uint8Array(copy).set(buf);
  return new Float64Array(copy);
}

/** The block rows of a trace, every level. */
export function buildLevels(captureId: number, t: Float64Array, v: Float64Array): LevelRow[] {
  const rows: LevelRow[] = [];
  const n = v.length;
  for (let b = 0; b * CAPTURE_BLOCK < n; b++) {
    const first = b * CAPTURE_BLOCK;
    const count = Math.min(CAPTURE_BLOCK, n - first);
    const data = new Float64Array(count * 2);
    for (let i = 0; i < count; i++) {
      data[2 * i] = t[first + i];
      data[2 * i + 1] = v[first + i];
    }
    rows.push(levelRow(captureId, 0, b, first, count, t[first], t[first + count - 1], data));
  }
  // Level 1 from the samples, level k + 1 from level k.
  let tl = t;
  let lo = v;
  let hi = v;
  for (let level = 1; tl.length > MAX_WINDOW_ENTRIES; level++) {
    const m = Math.ceil(tl.length / CAPTURE_FAN);
    const nt = new Float64Array(m);
    const nlo = new Float64Array(m);
    const nhi = new Float64Array(m);
    for (let e = 0; e < m; e++) {
      const s = e * CAPTURE_FAN;
      const end = Math.min(tl.length, s + CAPTURE_FAN);
      let a = lo[s];
      let z = hi[s];
      for (let i = s + 1; i < end; i++) {
        if (lo[i] < a) a = lo[i];
        if (hi[i] > z) z = hi[i];
      }
      nt[e] = tl[s];
      nlo[e] = a;
      nhi[e] = z;
    }
    for (let b = 0; b * CAPTURE_BLOCK < m; b++) {
      const first = b * CAPTURE_BLOCK;
      const count = Math.min(CAPTURE_BLOCK, m - first);
      const data = new Float64Array(count * 3);
      for (let i = 0; i < count; i++) {
        data[3 * i] = nt[first + i];
        data[3 * i + 1] = nlo[first + i];
        data[3 * i + 2] = nhi[first + i];
      }
      rows.push(levelRow(captureId, level, b, first, count, nt[first], nt[first + count - 1], data));
    }
    tl = nt;
    lo = nlo;
    hi = nhi;
  }
  return rows;
}

function levelRow(
  captureId: number,
  level: number,
  block: number,
  firstIndex: number,
  entries: number,
  startS: number,
  endS: number,
  data: Float64Array,
): LevelRow {
  return {
    captureId,
    level,
    block,
    firstIndex,
    entries,
    startS,
    endS,
    data: Buffer.from(data.buffer, data.byteOffset, data.byteLength),
  };
}

/** Stores the rows in batches (one statement per 32 blocks, about 2 MiB). */
export async function storeLevels(tx: Tx, rows: LevelRow[]): Promise<void> {
  for (let i = 0; i < rows.length; i += 32)
    await tx
      .insert(captureLevels)
      .values(rows.slice(i, i + 32))
      .onConflictDoNothing();
}

/** Drops a capture's levels and stores new ones (measured again with another channel or probe). */
export async function replaceLevels(tx: Tx, captureId: number, rows: LevelRow[]): Promise<void> {
  await tx.delete(captureLevels).where(eq(captureLevels.captureId, captureId));
  await storeLevels(tx, rows);
}

export async function hasLevels(captureId: number): Promise<boolean> {
  const [row] = await db
    .select({ level: captureLevels.level })
    .from(captureLevels)
    .where(and(eq(captureLevels.captureId, captureId), eq(captureLevels.level, 0)))
    .limit(1);
  return row !== undefined;
}

type Entries = { first: number; t: Float64Array; lo: Float64Array; hi: Float64Array };

/** Entries [from, to) of one level, read from the blocks that hold them. */
async function readEntries(captureId: number, level: number, from: number, to: number): Promise<Entries> {
  const blocks = await db
    .select({
      firstIndex: captureLevels.firstIndex,
      entries: captureLevels.entries,
      data: captureLevels.data,
    })
    .from(captureLevels)
    .where(
      and(
        eq(captureLevels.captureId, captureId),
        eq(captureLevels.level, level),
        gte(captureLevels.block, Math.floor(from / CAPTURE_BLOCK)),
        lte(captureLevels.block, Math.floor((to - 1) / CAPTURE_BLOCK)),
      ),
    )
    .orderBy(asc(captureLevels.block));
  const n = Math.max(0, to - from);
  const out: Entries = {
    first: from,
    t: new Float64Array(n),
    lo: new Float64Array(n),
    hi: new Float64Array(n),
  };
  const width = level === 0 ? 2 : 3;
  for (const b of blocks) {
    const d = f64(b.data);
    for (let i = Math.max(from, b.firstIndex); i < Math.min(to, b.firstIndex + b.entries); i++) {
      const k = (i - b.firstIndex) * width;
      out.t[i - from] = d[k];
      out.lo[i - from] = d[k + 1];
      out.hi[i - from] = d[k + width - 1];
    }
  }
  return out;
}

/** Index of the first sample whose time is >= x (n when none). */
async function sampleIndexAt(captureId: number, x: number, samples: number): Promise<number> {
  const [b] = await db
    .select({ firstIndex: captureLevels.firstIndex, data: captureLevels.data })
    .from(captureLevels)
    .where(
      and(eq(captureLevels.captureId, captureId), eq(captureLevels.level, 0), gte(captureLevels.endS, x)),
    )
    .orderBy(asc(captureLevels.block))
    .limit(1);
  if (!b) return samples;
  const d = f64(b.data);
  let lo = 0;
  let hi = d.length / 2;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (d[2 * mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return b.firstIndex + lo;
}

export type PlotWindow = {
  points: PlotPoint[];
  /** Samples per level entry the points were folded from (1 = the samples themselves). */
  samplesPerEntry: number;
  /** Time of the first sample after the last point (null: the points run to the end of the record). */
  untilS: number | null;
};

/** The envelope of [fromS, toS] from the stored levels; each point is the min and max of
 *  the samples from its tS up to the next point's tS (the last one up to untilS). */
export async function readWindow(
  captureId: number,
  fromS: number,
  toS: number,
  points = PLOT_POINTS,
): Promise<PlotWindow> {
  const [count] = await db
    .select({
      n: sql<number>`coalesce(max(${captureLevels.firstIndex} + ${captureLevels.entries}), 0)`.mapWith(
        Number,
      ),
    })
    .from(captureLevels)
    .where(and(eq(captureLevels.captureId, captureId), eq(captureLevels.level, 0)));
  const samples = count.n;
  if (samples === 0) return { points: [], samplesPerEntry: 1, untilS: null };
  const from = Math.max(0, (await sampleIndexAt(captureId, fromS, samples)) - 1);
  const to = Math.min(samples, (await sampleIndexAt(captureId, toS, samples)) + 1);
  let level = 0;
  let size = 1;
  while (Math.ceil((to - from) / size) > MAX_WINDOW_ENTRIES) {
    level++;
    size *= CAPTURE_FAN;
  }
  const levelCount = Math.ceil(samples / size);
  const a = Math.floor(from / size);
  const z = Math.ceil(to / size);
  // One entry more, when there is one, gives the time where the last point ends.
  const e = await readEntries(captureId, level, a, Math.min(levelCount, z + 1));
  const n = z - a;
  const buckets = Math.min(n, Math.max(1, Math.floor(points)));
  const out: PlotPoint[] = [];
  for (let k = 0; k < buckets; k++) {
    const s = Math.floor((k * n) / buckets);
    const end = Math.floor(((k + 1) * n) / buckets);
    let lo = e.lo[s];
    let hi = e.hi[s];
    for (let i = s + 1; i < end; i++) {
      if (e.lo[i] < lo) lo = e.lo[i];
      if (e.hi[i] > hi) hi = e.hi[i];
    }
    out.push({ tS: e.t[s], minV: lo, maxV: hi });
  }
  return { points: out, samplesPerEntry: size, untilS: z < levelCount ? e.t[n] : null };
}

/** Total bytes of the stored levels of one capture (for the benchmark and the audit). */
export async function levelBytes(captureId: number): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`coalesce(sum(octet_length(${captureLevels.data})), 0)`.mapWith(Number) })
    .from(captureLevels)
    .where(eq(captureLevels.captureId, captureId));
  return row.n;
}
