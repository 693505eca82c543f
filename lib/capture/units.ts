// Units found in scope export headers, and the scale to SI for each. Unit
// text is matched case-insensitively: scopes write "MV" for millivolts, never
// megavolts, so "mv"/"MV" both mean 1e-3 V.

const TIME_SCALE: Record<string, number> = {
  s: 1,
  sec: 1,
  ms: 1e-3,
  us: 1e-6,
  ns: 1e-9,
  ps: 1e-12,
};

const VOLT_SCALE: Record<string, number> = { v: 1, mv: 1e-3, uv: 1e-6, kv: 1e3 };

const RATE_SCALE: Record<string, number> = {
  hz: 1,
  khz: 1e3,
  mhz: 1e6,
  ghz: 1e9,
  "sa/s": 1,
  "ksa/s": 1e3,
  "msa/s": 1e6,
  "gsa/s": 1e9,
  "s/s": 1,
  "ks/s": 1e3,
  "ms/s": 1e6,
  "gs/s": 1e9,
};

/** Lower-case, with the micro sign and Greek mu both read as "u". */
function normalizeUnit(unit: string): string {
  return unit
    .trim()
    .toLowerCase()
    .replace(/[\u00b5\u03bc]/g, "u");
}

export function timeScale(unit: string): number | undefined {
  return TIME_SCALE[normalizeUnit(unit)];
}

export function voltScale(unit: string): number | undefined {
  return VOLT_SCALE[normalizeUnit(unit)];
}

export function isKnownUnit(unit: string): boolean {
  return timeScale(unit) !== undefined || voltScale(unit) !== undefined;
}

/** Strips surrounding quotes and blanks from a CSV field. */
export function unquote(field: string): string {
  const s = field.trim();
  return s.length >= 2 && s.startsWith('"') && s.endsWith('"') ? s.slice(1, -1).trim() : s;
}

/** "Time (ms)", "CH1 [mV]", "t / us" -> name and unit; no unit -> "". */
export function splitNameUnit(raw: string): { name: string; unit: string } {
  const text = unquote(raw);
  const bracket = /^(.*?)\s*[([]\s*([^)\]]*?)\s*[)\]]\s*$/.exec(text);
  if (bracket) return { name: bracket[1] || text, unit: bracket[2] };
  const slash = /^(.*?\S)\s*\/\s*([^\s/]+)$/.exec(text);
  if (slash && isKnownUnit(slash[2])) return { name: slash[1], unit: slash[2] };
  return { name: text, unit: "" };
}

/** Reads "1.0E-06", "1 us", "2,5E-06" (decimal comma), "500 kSa/s". */
export function parseQuantity(text: string, decimalComma: boolean): { value: number; unit: string } | null {
  const m = /^\s*([+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+-]?\d+)?)\s*([A-Za-z\u00b5\u03bc/]*)\s*$/.exec(
    unquote(text),
  );
  if (!m) return null;
  const numeric = decimalComma ? m[1].replace(",", ".") : m[1];
  if (!decimalComma && numeric.includes(",")) return null;
  const value = Number(numeric);
  return Number.isFinite(value) ? { value, unit: m[2] } : null;
}

/** A quantity read as a sample interval in seconds, from a time or a rate. */
export function intervalFromQuantity(
  q: { value: number; unit: string },
  fallbackUnit: string,
  isRate: boolean,
): number | null {
  const unit = q.unit || fallbackUnit;
  if (isRate || RATE_SCALE[normalizeUnit(unit)] !== undefined) {
    const scale = RATE_SCALE[normalizeUnit(unit || "hz")];
    if (scale === undefined || q.value <= 0) return null;
    return 1 / (q.value * scale);
  }
  const scale = timeScale(unit || "s");
  if (scale === undefined || q.value <= 0) return null;
  return q.value * scale;
}
