// One measured figure, its target and the verdict, and the printed table.

export type Comparison = "<" | "<=" | ">=" | "=";

export interface Target {
  op: Comparison;
  value: number;
}

export type Status = "PASS" | "MISS" | "INFO" | "SKIP";

export interface Figure {
  name: string;
  /** null when the part could not run (status SKIP, reason in note). */
  value: number | null;
  unit: string;
  target?: Target;
  status: Status;
  note?: string;
}

export function meets(value: number, t: Target): boolean {
  switch (t.op) {
    case "<":
      return value < t.value;
    case "<=":
      return value <= t.value;
    case ">=":
      return value >= t.value;
    case "=":
      return value === t.value;
  }
}

/** A measured figure; PASS/MISS when it has a target, INFO otherwise. */
export function figure(name: string, value: number, unit: string, target?: Target, note?: string): Figure {
  const status = !target ? "INFO" : Number.isFinite(value) && meets(value, target) ? "PASS" : "MISS";
  return { name, value, unit, target, status, ...(note ? { note } : {}) };
}

export function skipped(name: string, reason: string): Figure {
  return { name, value: null, unit: "", status: "SKIP", note: reason };
}

/** Four significant digits, no exponent for the magnitudes a benchmark prints. */
export function formatValue(value: number | null, unit: string): string {
  if (value === null) return "-";
  if (!Number.isFinite(value)) return String(value);
  const abs = Math.abs(value);
  const digits = abs === 0 || Number.isInteger(value) ? 0 : abs >= 100 ? 1 : abs >= 10 ? 2 : abs >= 1 ? 3 : 4;
  const text = value.toFixed(digits);
  return unit ? `${text} ${unit}` : text;
}

export function formatTarget(t: Target | undefined, unit: string): string {
  if (!t) return "";
  return `${t.op} ${formatValue(t.value, unit)}`;
}

/** Plain-text table: name, value, target, status, note; columns padded to the widest cell. */
export function formatTable(figures: readonly Figure[]): string {
  const rows = [
    ["figure", "value", "target", "status", "note"],
    ...figures.map((f) => [
      f.name,
      formatValue(f.value, f.unit),
      formatTarget(f.target, f.unit),
      f.status,
      f.note ?? "",
    ]),
  ];
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  const line = (r: string[]) =>
    r
      .map((cell, c) => (c === 1 ? cell.padStart(widths[c]) : cell.padEnd(widths[c])))
      .join("  ")
      .trimEnd();
  const rule = widths.map((w) => "-".repeat(w)).join("  ");
  return [line(rows[0]), rule, ...rows.slice(1).map(line)].join("\n");
}
