// 8-bit AVR Timer/Counter0 and Timer/Counter2 (same register layout on the
// ATmega328P and ATtiny25/45/85): Fast PWM mode 7 (TOP = OCRnA, output on
// OCnB), CTC mode 2 with COMnA0 toggle, CTC with the COMPA interrupt.
import type { PinAssignment } from "../plan-types";
import type { TimerConfig, TimerSpec } from "./spec";

// TCCRnA: COMnA1 7, COMnA0 6, COMnB1 5, COMnB0 4, WGMn1 1, WGMn0 0.
// TCCRnB: WGMn2 3, CSn2:0 2..0.
const COMA0 = 1 << 6;
const COMB1 = 1 << 5;
const WGM1 = 1 << 1;
const WGM0 = 1 << 0;
const WGM2 = 1 << 3;

export interface Avr8bitOptions {
  index: 0 | 2;
  /** Divider -> CSn2:0 value. */
  clockSelect: Record<number, number>;
  /** Interrupt mask register name and OCIEnA bit value. */
  maskRegister: string;
  maskValue: number;
  pinA: PinAssignment;
  pinB: PinAssignment;
}

export function avr8bitTimer(o: Avr8bitOptions): TimerSpec {
  const x = String(o.index);
  const cs = (c: TimerConfig) => o.clockSelect[c.divider];
  const dividers = Object.keys(o.clockSelect)
    .map(Number)
    .sort((a, b) => a - b);
  const gpio: PinAssignment = { ...o.pinA, function: "GPIO" };
  return {
    name: `TIMER${x}`,
    bits: 8,
    dividers,
    isrDividers: dividers,
    dividerQuantum: 1,
    // pwm needs a high time of 1..TOP counts, so at least 2 counts per period.
    counts: { pwm: { min: 2, max: 256 }, toggle: { min: 1, max: 256 }, isr: { min: 1, max: 256 } },
    modeFactors: { pwm: [1], toggle: [2] },
    highStep: 1,
    pins: { pwm: o.pinB, toggle: o.pinA, isr: gpio },
    registers(c) {
      const n = c.periodCounts;
      if (c.mode === "pwm")
        return {
          [`TCCR${x}A`]: COMB1 | WGM1 | WGM0,
          [`TCCR${x}B`]: WGM2 | cs(c),
          [`OCR${x}A`]: n - 1,
          // Fast PWM, non-inverting: OCnB is high for OCRnB + 1 counts.
          [`OCR${x}B`]: c.highCounts - 1,
        };
      if (c.mode === "toggle")
        return { [`TCCR${x}A`]: COMA0 | WGM1, [`TCCR${x}B`]: cs(c), [`OCR${x}A`]: n - 1 };
      return {
        [`TCCR${x}A`]: WGM1,
        [`TCCR${x}B`]: cs(c),
        [`OCR${x}A`]: n - 1,
        [o.maskRegister]: o.maskValue,
      };
    },
  };
}
