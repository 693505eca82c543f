// ATmega328P firmware that keeps the old stage's selector switch: one input
// pin per position (internal pull-up, the switch's common contact to ground,
// so the selected position reads low), debounced, and the engine's selector
// table (buildSelectorTable: the old stage's own period per switched value,
// one Timer1 divider) as ICR1/OCR1A per position. Rendered from
// templates/atmega328p/selector.c.hbs. Facts: ATmega328P datasheet
// DS40002061, I/O-Ports chapter (DDxn = 0 and PORTxn = 1: input with pull-up;
// PINx reads the pin), Timer/Counter1 (mode 14, TOV1 at TOP, ICR1 not double
// buffered). Package pins of PD2..PD7 on PDIP-28 from memory.
import type { SelectorTable } from "@/lib/engine";
import { render } from "./render";
import {
  checkPositionCount,
  checkPositionCounts,
  inputMask,
  SELECTOR_DEBOUNCE_MS,
  selectorWiringLines,
  type WiringLine,
} from "./selector-common";

/** Input pins in position order: PD2..PD7 (PDIP-28 pins 4, 5, 6, 11, 12, 13; from memory). */
const ATMEGA328P_SELECTOR_PINS = [
  { bit: 2, packagePin: 4 },
  { bit: 3, packagePin: 5 },
  { bit: 4, packagePin: 6 },
  { bit: 5, packagePin: 11 },
  { bit: 6, packagePin: 12 },
  { bit: 7, packagePin: 13 },
] as const;

const TIMER1_CS: Record<number, string> = {
  1: "(1 << CS10)",
  8: "(1 << CS11)",
  64: "(1 << CS11) | (1 << CS10)",
  256: "(1 << CS12)",
  1024: "(1 << CS12) | (1 << CS10)",
};

type SelectorPin = { readonly bit: number; readonly packagePin: number };

/** One pin-map line per position (contact to a pulled-up pin) and the common contact to ground. */
function selectorWiring(
  table: SelectorTable,
  valueText: (v: number) => string,
  port: string,
  pinList: readonly SelectorPin[],
  groundPackagePin: number,
): WiringLine[] {
  const inputs = pinList.map((p) => ({ name: `${port}${p.bit}`, packagePin: p.packagePin }));
  return selectorWiringLines(table, valueText, inputs, "internal pull-up", {
    role: "switch common contact to ground",
    pin: "GND",
    packagePin: groundPackagePin,
  });
}

/** Template fields both AVR selector templates share: the input mask and TOP/OCR per position. */
function selectorFields(table: SelectorTable, pinList: readonly SelectorPin[], startIndex: number) {
  const pins = pinList.slice(0, table.positions.length);
  return {
    debounceMs: SELECTOR_DEBOUNCE_MS,
    startIndex,
    noContactRule: table.noContactRule,
    mask: inputMask(
      pins.map((p) => p.bit),
      2,
    ),
    positions: table.positions.map((p, i) => ({
      position: p.position,
      bit: pins[i].bit,
      top: p.periodCounts - 1,
      ocr: p.highCounts - 1,
    })),
  };
}

export function atmega328pSelectorWiring(
  table: SelectorTable,
  valueText: (v: number) => string,
): WiringLine[] {
  return selectorWiring(table, valueText, "PD", ATMEGA328P_SELECTOR_PINS, 8);
}

export function renderAtmega328pSelector({
  table,
  startIndex,
  controlText,
}: {
  table: SelectorTable;
  /** position used until a contact reads low: the stage's stored value */
  startIndex: number;
  controlText: string;
}): string {
  const plan = table.plan;
  if (plan.device !== "atmega328p" || plan.timer !== "TIMER1" || plan.mode !== "pwm")
    throw new Error("The selector firmware runs on ATmega328P Timer1 fast PWM plans.");
  checkPositionCount(table, ATMEGA328P_SELECTOR_PINS.length, "the ATmega328P", "PD2..PD7");
  if (plan.pin.port.startsWith("PD")) throw new Error(`targets: ${plan.pin.port} is a selector input.`);
  const cs = TIMER1_CS[plan.divider];
  if (!cs) throw new Error(`divider ${plan.divider} is not a Timer1 clock select.`);
  return render("atmega328p/selector.c.hbs", {
    deviceName: "ATmega328P",
    controlText,
    clockHz: plan.clockHz,
    divider: plan.divider,
    csExpr: cs,
    ...selectorFields(table, ATMEGA328P_SELECTOR_PINS, startIndex),
  });
}

/**
 * ATtiny85 input pins in position order: PB0, PB2, PB3, PB4 (PDIP-8 pins 5, 7, 2, 3;
 * from memory). PB1 carries OC0B, PB5 is RESET. ATtiny25/45/85 datasheet, I/O
 * Ports chapter (pull-up with DDBn = 0, PORTBn = 1) and Timer/Counter0 (mode 7:
 * TOP = OCR0A; OCR0A/OCR0B double buffered, updated at BOTTOM).
 */
const ATTINY85_SELECTOR_PINS = [
  { bit: 0, packagePin: 5 },
  { bit: 2, packagePin: 7 },
  { bit: 3, packagePin: 2 },
  { bit: 4, packagePin: 3 },
] as const;

export function attiny85SelectorWiring(table: SelectorTable, valueText: (v: number) => string): WiringLine[] {
  return selectorWiring(table, valueText, "PB", ATTINY85_SELECTOR_PINS, 4);
}

export function renderAttiny85Selector({
  table,
  startIndex,
  controlText,
}: {
  table: SelectorTable;
  startIndex: number;
  controlText: string;
}): string {
  const plan = table.plan;
  if (plan.device !== "attiny85" || plan.timer !== "TIMER0" || plan.mode !== "pwm")
    throw new Error("The selector firmware runs on ATtiny85 Timer0 fast PWM plans.");
  checkPositionCount(table, ATTINY85_SELECTOR_PINS.length, "the ATtiny85", "PB0, PB2, PB3, PB4");
  if (plan.pin.port !== "PB1") throw new Error("targets: the ATtiny85 selector firmware drives OC0B on PB1.");
  checkPositionCounts(table, 256);
  return render("attiny85/selector.c.hbs", {
    deviceName: "ATtiny85",
    controlText,
    clockHz: plan.clockHz,
    divider: plan.divider,
    tccr0a: plan.registers.TCCR0A,
    tccr0b: plan.registers.TCCR0B,
    ...selectorFields(table, ATTINY85_SELECTOR_PINS, startIndex),
  });
}
