// A number as the forms show it: engineering prefix without the unit, six
// significant digits, and an ASCII "u" for micro so that what the field shows
// can be typed back exactly as it reads ("4k7", "100n", "2u2").
import { formatEng, formatRatio, parseEng, type EngUnit } from "@/lib/engine";

export function formText(v: number): string {
  return formatEng(v, "", 6).replace("µ", "u");
}

/**
 * What a form field read, for the line under it ("1m5" -> "1.5 mΩ"), so a
 * slip is visible before anything is saved. Ratios print as plain decimals.
 * Null when the field is blank or does not read (its error says why).
 */
export function echoText(text: unknown, unit: EngUnit): string | null {
  if (typeof text !== "string" || text.trim() === "") return null;
  try {
    const v = parseEng(text, unit);
    return unit === "" ? formatRatio(v, 6) : formatEng(v, unit, 6);
  } catch {
    return null;
  }
}

/** A default value in its unit, for placeholders: "default 5 µs", "default 0.65". */
export function defaultText(value: number, unit: EngUnit): string {
  return `default ${unit === "" ? formatRatio(value, 6) : formatEng(value, unit, 6)}`;
}
