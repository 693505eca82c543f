// Number formatting for generated text. Deterministic (no locale), units
// always printed, engineering prefixes as in the rest of the product.

const PREFIXES: [number, string][] = [
  [1e9, "G"],
  [1e6, "M"],
  [1e3, "k"],
  [1, ""],
  [1e-3, "m"],
  [1e-6, "µ"],
  [1e-9, "n"],
  [1e-12, "p"],
];

/** Engineering notation with `digits` significant digits: 1.000000 ms. */
export function eng(value: number, unit: string, digits = 7): string {
  if (!Number.isFinite(value)) return `— ${unit}`.trim();
  if (value === 0) return `0 ${unit}`;
  const abs = Math.abs(value);
  const [scale, prefix] = PREFIXES.find(([s]) => abs >= s * 0.9999999999) ?? PREFIXES[PREFIXES.length - 1];
  return `${(value / scale).toPrecision(digits)} ${prefix}${unit}`;
}

/** C comments stay ASCII: "us" for micro. */
export function engAscii(value: number, unit: string, digits = 7): string {
  return eng(value, unit, digits).replace("µ", "u");
}

/** ppm to ±10 000 ppm, then percent, then a ratio to the target (as the pages print it). */
export function ppm(value: number): string {
  if (!Number.isFinite(value)) return "— ppm";
  const rounded = Math.abs(value) < 0.0005 ? 0 : value;
  if (Math.abs(rounded) >= 1e6) return `${Number((1 + rounded / 1e6).toPrecision(4))} × the target`;
  if (Math.abs(rounded) >= 1e4) return `${rounded >= 0 ? "+" : ""}${(rounded / 1e4).toFixed(3)} %`;
  return `${rounded >= 0 ? "+" : ""}${rounded.toFixed(3)} ppm`;
}

export function hex(value: number, width = 2): string {
  return "0x" + (value >>> 0).toString(16).toUpperCase().padStart(width, "0");
}

export function percent(fraction: number, digits = 3): string {
  return `${(fraction * 100).toFixed(digits)} %`;
}
