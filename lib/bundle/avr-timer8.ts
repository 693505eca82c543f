// 8-bit AVR Timer/Counter0 and Timer/Counter2 (ATmega328P datasheet, 8-bit
// Timer/Counter0 and Timer/Counter2 chapters; ATtiny25/45/85 datasheet,
// Timer/Counter0): fast PWM mode 7 (TOP = OCRxA, output on OCxB), CTC mode 2
// with OCxA toggle, CTC with the compare A interrupt.
import { bits, intRange, unsupported, write, type RegisterWrite } from "./device-view";
import type { BundlePlan } from "./types";

export interface Avr8Options {
  /** 0 or 2 */
  n: 0 | 2;
  /** clock-select value per divider */
  cs: Record<number, number>;
  /** interrupt mask register name: TIMSK0 / TIMSK2 (ATmega328P), TIMSK (ATtiny85) */
  timsk: string;
  ocieBit: number;
}

export function avrTimer8(
  plan: BundlePlan,
  o: Avr8Options,
): { writes: RegisterWrite[]; isrVector: string | null } {
  const x = String(o.n);
  const cs = o.cs[plan.divider] ?? unsupported(plan, `prescaler ${plan.divider}`);
  const csNames = [`CS${x}0`, `CS${x}1`, `CS${x}2`].filter((_, i) => (cs >> i) & 1);
  const N = plan.divider;
  const top = intRange(plan, `OCR${x}A`, plan.periodCounts - 1, 1, 255);
  const A = `OCR${x}A`;
  if (plan.mode === "pwm") {
    const ocr = intRange(plan, `OCR${x}B`, plan.highCounts - 1, 0, top);
    return {
      isrVector: null,
      writes: [
        write(A, top, String(top), `TOP = periodCounts - 1; period = N*(1+${A})/f = ${N}*${top + 1}/F_CPU`),
        write(`OCR${x}B`, ocr, String(ocr), `high for OCR${x}B+1 counts = ${ocr + 1} counts`),
        write(
          `TCCR${x}A`,
          0x23,
          bits([`COM${x}B1`, `WGM${x}1`, `WGM${x}0`]),
          `OC${x}B non-inverting, WGM${x}1:0 = 11`,
        ),
        write(
          `TCCR${x}B`,
          0x08 | cs,
          bits([`WGM${x}2`, ...csNames]),
          `WGM${x}2 = 1 (fast PWM, TOP = ${A}), clock = F_CPU/${N}; starts the timer`,
        ),
      ],
    };
  }
  if (plan.mode === "toggle") {
    return {
      isrVector: null,
      writes: [
        write(
          A,
          top,
          String(top),
          `TOP = periodCounts - 1; period = 2*N*(1+${A})/f = 2*${N}*${top + 1}/F_CPU`,
        ),
        write(
          `TCCR${x}A`,
          0x42,
          bits([`COM${x}A0`, `WGM${x}1`]),
          `toggle OC${x}A on compare match, CTC (TOP = ${A})`,
        ),
        write(`TCCR${x}B`, cs, bits(csNames), `clock = F_CPU/${N}; starts the timer`),
      ],
    };
  }
  return {
    isrVector: `TIMER${x}_COMPA_vect`,
    writes: [
      write(A, top, String(top), `interrupt every N*(1+${A})/f = ${N}*${top + 1}/F_CPU`),
      write(o.timsk, 1 << o.ocieBit, bits([`OCIE${x}A`]), "compare A interrupt on"),
      write(`TCCR${x}A`, 0x02, bits([`WGM${x}1`]), `CTC, TOP = ${A}; pin driven by the interrupt`),
      write(`TCCR${x}B`, cs, bits(csNames), `clock = F_CPU/${N}; starts the timer`),
    ],
  };
}
