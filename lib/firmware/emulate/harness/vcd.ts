// Value Change Dump reader (IEEE 1364-2005, section 18) for one-bit signals:
// enough for the traces simavr writes. Repeated values (simavr writes some
// changes twice) and x/z states are dropped, leaving real edges only.

export interface Edge {
  /** seconds */
  t: number;
  level: 0 | 1;
}

const UNIT_S: Record<string, number> = { s: 1, ms: 1e-3, us: 1e-6, ns: 1e-9, ps: 1e-12, fs: 1e-15 };

export function parseVcd(text: string, signal: string): Edge[] {
  const ts = /\$timescale\s+(\d+)\s*(s|ms|us|ns|ps|fs)\s+\$end/.exec(text);
  if (!ts) throw new Error("VCD has no $timescale");
  const tick = Number(ts[1]) * UNIT_S[ts[2]];
  const vars = [...text.matchAll(/\$var\s+\S+\s+(\d+)\s+(\S+)\s+(\S+)(?:\s+\[[^\]]*\])?\s+\$end/g)];
  const v = vars.find((m) => m[3] === signal);
  if (!v) throw new Error(`VCD has no signal ${signal} (has ${vars.map((m) => m[3]).join(", ")})`);
  if (v[1] !== "1") throw new Error(`signal ${signal} is ${v[1]} bits wide; this reader takes 1-bit signals`);
  const id = v[2];
  const body = text.slice(text.indexOf("$enddefinitions"));
  const edges: Edge[] = [];
  let now = 0;
  let last: string | null = null;
  for (const raw of body.split(/\s+/)) {
    if (raw.startsWith("#")) {
      now = Number(raw.slice(1)) * tick;
    } else if (raw.length >= 2 && "01xXzZ".includes(raw[0]) && raw.slice(1) === id) {
      const val = raw[0].toLowerCase();
      if (val === last) continue;
      last = val;
      if (val === "0" || val === "1") edges.push({ t: now, level: val === "1" ? 1 : 0 });
    }
  }
  // an x -> 0 or x -> 1 start is not an edge of the waveform
  return edges.filter((e, i) => i > 0 && edges[i - 1].level !== e.level);
}

export interface Measured {
  periods: number[];
  highs: number[];
}

/** Periods between rising edges and high times from each rising to the next falling edge. */
export function measure(edges: Edge[]): Measured {
  const rises = edges.filter((e) => e.level === 1).map((e) => e.t);
  const periods = rises.slice(1).map((t, i) => t - rises[i]);
  const highs: number[] = [];
  for (const r of rises) {
    const fall = edges.find((e) => e.level === 0 && e.t > r);
    if (fall) highs.push(fall.t - r);
  }
  return { periods, highs };
}
