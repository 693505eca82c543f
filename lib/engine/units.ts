// Engineering notation for the UI and the API: reads IEC 60062 letter-and-digit
// codes (4k7, 2M2, R47, 4u7, 1n5) and SI-prefixed values with units
// ("4.7 kΩ", "100 nF", "2.34 ms", "10 kHz"), and prints values the same way.
// Case matters where SI says so: m = milli, M = mega; k and K both read kilo.
import { EngineError } from "./errors";

export type EngUnit = "Ω" | "F" | "V" | "A" | "s" | "Hz" | "%" | "ppm" | "";

const PREFIX: Record<string, number> = {
  T: 1e12,
  G: 1e9,
  M: 1e6,
  k: 1e3,
  K: 1e3,
  "": 1,
  m: 1e-3,
  u: 1e-6,
  µ: 1e-6, // U+00B5 micro sign
  μ: 1e-6, // U+03BC Greek small mu
  n: 1e-9,
  p: 1e-12,
  f: 1e-15,
};

// IEC 60062 resistance code letters (R marks the decimal point of ohms).
const CODE_LETTER: Record<string, number> = { ...PREFIX, R: 1, r: 1 };
delete CODE_LETTER[""];

const UNIT_WORDS: Record<string, EngUnit> = {
  "\u03a9": "Ω", // Greek capital omega, as keyboards give it
  "\u2126": "Ω", // ohm sign
  ohm: "Ω",
  ohms: "Ω",
  Ohm: "Ω",
  F: "F",
  V: "V",
  A: "A",
  s: "s",
  Hz: "Hz",
  "%": "%",
  ppm: "ppm",
};

const NUMBER = String.raw`[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?`;
const PREFIXES = "TGMkKmuµμnpf";
const PLAIN_RE = new RegExp(
  `^(${NUMBER})\\s*([${PREFIXES}]?)\\s*(\u03a9|\u2126|ohms?|Ohm|F|V|A|s|Hz|%|ppm)?$`,
);
// Letter-as-decimal-point code: 4k7, 2M2, R47, 4R7, 47R, 4u7, 1n5, p68.
const CODE_RE = new RegExp(`^([+-]?)(\\d*)([${PREFIXES}Rr])(\\d*)\\s*(\u03a9|\u2126|ohms?|Ohm|F|V|A|s|Hz)?$`);

// Scales by a power of ten in decimal, so "100n" is exactly the double nearest
// 1e-7 (100 * 1e-9 would be 1.0000000000000001e-7).
function scaleDecimal(num: string, factor: number): number {
  const exp = Math.round(Math.log10(factor));
  const [mantissa, e = "0"] = num.toLowerCase().split("e");
  return Number(`${mantissa}e${Number(e) + exp}`);
}

function fail(text: string, why: string): never {
  throw new EngineError("invalid-value", `Cannot read "${text}" as a value: ${why}.`);
}

/**
 * Reads a value in engineering notation and returns it in SI base units.
 * With `expect`, a unit written in the text must be that unit.
 */
export function parseEng(text: string, expect?: EngUnit): number {
  let raw = String(text).trim();
  if (raw === "") fail(text, "it is empty");
  // Thousands separators are read where they cannot be a decimal comma: two
  // or more groups ("16,000,000") or a decimal point after them ("1,500.5").
  const grouped = /^([+-]?\d{1,3}(?:,\d{3})+)(\.\d*)?(.*)$/.exec(raw);
  if (grouped) {
    const groups = grouped[1].split(",").length - 1;
    if (groups < 2 && grouped[2] === undefined)
      fail(
        text,
        `"${grouped[1]}" could be a thousands separator or a decimal comma; write it without the comma`,
      );
    raw = grouped[1].replace(/,/g, "") + (grouped[2] ?? "") + grouped[3];
  }
  if (/,/.test(raw)) fail(text, "use a point as the decimal separator");

  let value: number;
  let unit: EngUnit | undefined;
  const plain = PLAIN_RE.exec(raw);
  const code = plain ? null : CODE_RE.exec(raw);
  if (plain) {
    const [, num, prefix, unitWord] = plain;
    unit = unitWord ? UNIT_WORDS[unitWord] : undefined;
    // "1 F" is one farad, "1 f" is femto; "5 s" is seconds, never a prefix.
    value = scaleDecimal(num, PREFIX[prefix]);
  } else if (code) {
    const [, sign, whole, letter, frac, unitWord] = code;
    if (whole === "" && frac === "") fail(text, `"${letter}" needs digits`);
    if (whole === "" && !/[Rr]/.test(letter) && !/[pnuµμ]/.test(letter)) {
      fail(text, `a code needs digits before "${letter}"`);
    }
    unit = unitWord ? UNIT_WORDS[unitWord] : undefined;
    if (/[Rr]/.test(letter) && unit && unit !== "Ω") fail(text, `"R" codes are resistances`);
    value = scaleDecimal(`${sign}${whole || "0"}.${frac || "0"}`, CODE_LETTER[letter]);
  } else {
    fail(text, "expected a number with an optional SI prefix and unit, e.g. 4k7, 100 nF, 2.34 ms");
  }
  if (/[Rr]/.test(raw) && code && !unit) unit = "Ω";

  if (unit === "%") value /= 100;
  if (unit === "ppm") value /= 1e6;
  if (expect !== undefined && unit !== undefined && unit !== expect) {
    fail(text, `expected ${expect === "" ? "a plain number" : `a value in ${expect}`}`);
  }
  if (!Number.isFinite(value)) fail(text, "it is out of range");
  return value;
}

const FORMAT_PREFIX: [number, string][] = [
  [1e12, "T"],
  [1e9, "G"],
  [1e6, "M"],
  [1e3, "k"],
  [1, ""],
  [1e-3, "m"],
  [1e-6, "µ"],
  [1e-9, "n"],
  [1e-12, "p"],
  [1e-15, "f"],
];

function trimDigits(x: number, digits: number): string {
  const s = x.toPrecision(digits);
  return s.includes("e") ? String(Number(s)) : s.replace(/(\.\d*?)0+$/, "$1").replace(/\.$/, "");
}

/**
 * Prints a value with an SI prefix and `digits` significant digits, trailing
 * zeros dropped: 4700 "Ω" -> "4.7 kΩ", 1e-7 "F" -> "100 nF".
 * Without a unit the prefix sticks to the number: 4700 -> "4.7k".
 */
export function formatEng(value: number, unit: EngUnit | "ohm" = "", digits = 3): string {
  const u = unit === "ohm" ? "Ω" : unit;
  const sep = u === "" ? "" : " ";
  if (!Number.isFinite(value)) return Number.isNaN(value) ? "—" : value > 0 ? "∞" : "−∞";
  if (u === "%") return `${trimDigits(value * 100, digits)} %`;
  if (u === "ppm") return `${trimDigits(value * 1e6, digits)} ppm`;
  if (value === 0) return `0${sep}${u}`;
  const mag = Math.abs(value);
  let i = FORMAT_PREFIX.findIndex(([f]) => mag >= f * (1 - 5e-16));
  if (i < 0) i = FORMAT_PREFIX.length - 1;
  let [factor, prefix] = FORMAT_PREFIX[i];
  let mantissa = Number((value / factor).toPrecision(digits));
  // Rounding can carry into the next prefix: 999.96 -> 1000 -> "1 k".
  if (Math.abs(mantissa) >= 1000 && i > 0) {
    [factor, prefix] = FORMAT_PREFIX[i - 1];
    mantissa = Number((value / factor).toPrecision(digits));
  }
  return `${trimDigits(mantissa, digits)}${sep}${prefix}${u}`;
}

/**
 * A relative value given in ppm, printed where people read it easily: ppm up
 * to ±10 000 ppm, percent up to ±100 %, beyond that as a ratio to the target
 * ("+14319198.8 ppm" reads "15.3 × the target"). `signed` adds "+" to positive values.
 */
export function formatPpm(ppm: number, digits = 3, signed = false): string {
  if (!Number.isFinite(ppm)) return "—";
  const sign = signed && ppm > 0 ? "+" : "";
  const mag = Math.abs(ppm);
  if (mag < 1e4) return `${sign}${trimDigits(ppm, digits)} ppm`;
  if (mag < 1e6) return `${sign}${trimDigits(ppm / 1e4, digits)} %`;
  return `${trimDigits(1 + ppm / 1e6, digits)} × the target`;
}

/** A dimensionless ratio as a plain decimal, never with an SI prefix: 0.65, not "650m". */
export function formatRatio(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return "—";
  return trimDigits(value, digits);
}
