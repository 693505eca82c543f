// ATtiny85. ATtiny25/45/85 datasheet (Microchip DS2586): 8-bit Timer/Counter0
// (CTC mode 2, fast PWM mode 7 with TOP = OCR0A, CS02:0) and 8-bit
// Timer/Counter1 (PWM1A with TOP = OCR1C, CTC1, CS13:0 = log2(N) + 1).
import { EngineError } from "@/lib/engine/errors";
import { bits, intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { avrTimer8 } from "./avr-timer8";
import { avrDeviceView } from "./avr-clock-view";
import type { BundlePlan } from "./types";

const CS0: Record<number, number> = { 1: 1, 8: 2, 64: 3, 256: 4, 1024: 5 };

function timer0(plan: BundlePlan): { writes: RegisterWrite[]; isr: string | null } {
  const r = avrTimer8(plan, { n: 0, cs: CS0, timsk: "TIMSK", ocieBit: 4 });
  return { writes: r.writes, isr: r.isrVector };
}

function timer1(plan: BundlePlan): { writes: RegisterWrite[]; isr: string | null } {
  const log2 = Math.log2(plan.divider);
  if (!Number.isInteger(log2) || log2 < 0 || log2 > 14) unsupported(plan, `prescaler ${plan.divider}`);
  const cs = log2 + 1;
  const csNames = ["CS10", "CS11", "CS12", "CS13"].filter((_, i) => (cs >> i) & 1);
  const N = plan.divider;
  const top = intRange(plan, "OCR1C", plan.periodCounts - 1, 1, 255);
  if (plan.mode === "pwm") {
    const ocr = intRange(plan, "OCR1A", plan.highCounts - 1, 0, top);
    return {
      isr: null,
      writes: [
        write(
          "OCR1C",
          top,
          String(top),
          `TOP = periodCounts - 1; period = N*(1+OCR1C)/f = ${N}*${top + 1}/F_CPU`,
        ),
        write("OCR1A", ocr, String(ocr), `high for OCR1A+1 counts = ${ocr + 1} counts`),
        write(
          "TCCR1",
          0x60 | cs,
          bits(["PWM1A", "COM1A1", ...csNames]),
          `PWM on OC1A, TOP = OCR1C, clock = F_CPU/${N}; starts the timer`,
        ),
      ],
    };
  }
  if (plan.mode === "toggle") {
    return {
      isr: null,
      writes: [
        write(
          "OCR1C",
          top,
          String(top),
          `TOP = periodCounts - 1; period = 2*N*(1+OCR1C)/f = 2*${N}*${top + 1}/F_CPU`,
        ),
        write("OCR1A", top, String(top), "OC1A toggles at the same count as TOP"),
        write(
          "TCCR1",
          0x90 | cs,
          bits(["CTC1", "COM1A0", ...csNames]),
          `clear on OCR1C, toggle OC1A, clock = F_CPU/${N}; starts the timer`,
        ),
      ],
    };
  }
  return {
    isr: "TIMER1_COMPA_vect",
    writes: [
      write("OCR1C", top, String(top), `interrupt every N*(1+OCR1C)/f = ${N}*${top + 1}/F_CPU`),
      write("OCR1A", top, String(top), "compare A at TOP raises the interrupt"),
      write("TIMSK", 0x40, bits(["OCIE1A"]), "compare A interrupt on"),
      write(
        "TCCR1",
        0x80 | cs,
        bits(["CTC1", ...csNames]),
        `clear on OCR1C, clock = F_CPU/${N}; starts the timer`,
      ),
    ],
  };
}

export function attiny85View(plan: BundlePlan): DeviceView {
  const t = plan.timer.toUpperCase();
  const r = t === "TIMER0" ? timer0(plan) : t === "TIMER1" ? timer1(plan) : null;
  if (!r) throw new EngineError("unknown-timer", `attiny85: no timer ${plan.timer}`);
  return avrDeviceView(plan, r.writes, r.isr);
}
