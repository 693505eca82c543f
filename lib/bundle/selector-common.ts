// What the selector-switch parts of every device share: the debounce time,
// the pin-map lines (one contact per pulled-up input, the common contact to
// ground), the opening checks of a table against the part's inputs, and the
// input mask. The device files keep their pins, registers and templates.
import type { SelectorTable } from "@/lib/engine";

/**
 * Debounce: a position is taken once the pins read the same for this many
 * 1 ms samples. Rotary and slide switches settle within a few milliseconds
 * (common practice, no source).
 */
export const SELECTOR_DEBOUNCE_MS = 20;

export type WiringLine = { role: string; pin: string; packagePin: number };

/** One selector input: its datasheet name, package pin and an optional note for the pin map. */
export interface SelectorInput {
  readonly name: string;
  readonly packagePin: number;
  readonly note?: string;
}

/** One pin-map line per position (contact to a pulled-up input) and the common contact to ground. */
export function selectorWiringLines(
  table: SelectorTable,
  valueText: (v: number) => string,
  inputs: readonly SelectorInput[],
  pullUp: string,
  ground: WiringLine,
): WiringLine[] {
  return [
    ...table.positions.map((p, i) => ({
      role: `switch position ${p.position} (${valueText(p.value)}): contact to this pin, ${pullUp}${inputs[i].note ?? ""}`,
      pin: inputs[i].name,
      packagePin: inputs[i].packagePin,
    })),
    ground,
  ];
}

/** Refuses a table with fewer than 2 or more positions than the part has inputs (message names control.values). */
export function checkPositionCount(
  table: SelectorTable,
  inputs: number,
  what: string,
  pinRange: string,
): number {
  const n = table.positions.length;
  if (n < 2 || n > inputs)
    throw new Error(`control.values: ${what} reads 2 to ${inputs} positions (${pinRange}).`);
  return n;
}

/** Refuses a position whose period needs more counts than the timer holds. */
export function checkPositionCounts(table: SelectorTable, maxCounts: number): void {
  for (const p of table.positions)
    if (p.periodCounts > maxCounts)
      throw new Error(`control: position ${p.position} needs more than ${maxCounts} counts.`);
}

/** The inputs' bit mask in upper-case hex, padded to `digits`. */
export function inputMask(bits: readonly number[], digits: number): string {
  const mask = bits.reduce((m, b) => m | (1 << b), 0);
  return `0x${mask.toString(16).toUpperCase().padStart(digits, "0")}`;
}
