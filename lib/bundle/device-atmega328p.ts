// ATmega328P. ATmega328P datasheet (Microchip DS40002061): 16-bit
// Timer/Counter1 (Fast PWM mode 14 with TOP = ICR1, CTC mode 4 with TOP =
// OCR1A, CS12:0), 8-bit Timer/Counter0 and Timer/Counter2 (see avr-timer8.ts).
import { EngineError } from "@/lib/engine/errors";
import { avrTimer8 } from "./avr-timer8";
import { bits, intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { avrDeviceView } from "./avr-clock-view";
import type { BundlePlan } from "./types";

const CS01: Record<number, number> = { 1: 1, 8: 2, 64: 3, 256: 4, 1024: 5 };
const CS2: Record<number, number> = { 1: 1, 8: 2, 32: 3, 64: 4, 128: 5, 256: 6, 1024: 7 };
const BIT = { COM1B0: 4, COM1B1: 5, COM1A0: 6, COM1A1: 7, WGM11: 1, WGM12: 3, WGM13: 4, OCIE1A: 1 };

function timer1(plan: BundlePlan): { writes: RegisterWrite[]; isrVector: string | null } {
  const cs = CS01[plan.divider] ?? unsupported(plan, `prescaler ${plan.divider}`);
  const csNames = ["CS10", "CS11", "CS12"].filter((_, i) => (cs >> i) & 1);
  const N = plan.divider;
  const channel = /OC1B/i.test(plan.pin.function) ? "B" : "A";
  const top = intRange(plan, "TOP", plan.periodCounts - 1, 1, 65535);
  if (plan.mode === "pwm") {
    const com = channel === "A" ? "COM1A1" : "COM1B1";
    const ocr = intRange(plan, `OCR1${channel}`, plan.highCounts - 1, 0, top);
    return {
      isrVector: null,
      writes: [
        write(
          "ICR1",
          top,
          String(top),
          `TOP = periodCounts - 1; period = N*(1+TOP)/f = ${N}*${top + 1}/F_CPU`,
        ),
        write(`OCR1${channel}`, ocr, String(ocr), `high for OCR1${channel}+1 counts = ${ocr + 1} counts`),
        write(
          "TCCR1A",
          (1 << BIT[com]) | (1 << BIT.WGM11),
          bits([com, "WGM11"]),
          "non-inverting, WGM11:10 = 10",
        ),
        write(
          "TCCR1B",
          (1 << BIT.WGM13) | (1 << BIT.WGM12) | cs,
          bits(["WGM13", "WGM12", ...csNames]),
          `WGM13:12 = 11 (fast PWM, TOP = ICR1), clock = F_CPU/${N}; starts the timer`,
        ),
      ],
    };
  }
  if (plan.mode === "toggle") {
    const com = channel === "A" ? "COM1A0" : "COM1B0";
    const w = [
      write(
        "OCR1A",
        top,
        String(top),
        `TOP = periodCounts - 1; period = 2*N*(1+OCR1A)/f = 2*${N}*${top + 1}/F_CPU`,
      ),
    ];
    if (channel === "B") w.push(write("OCR1B", top, String(top), "OC1B toggles at the same count as TOP"));
    w.push(
      write("TCCR1A", 1 << BIT[com], bits([com]), `toggle OC1${channel} on compare match, WGM11:10 = 00`),
      write(
        "TCCR1B",
        (1 << BIT.WGM12) | cs,
        bits(["WGM12", ...csNames]),
        `WGM13:0 = 0100 (CTC, TOP = OCR1A), clock = F_CPU/${N}; starts the timer`,
      ),
    );
    return { isrVector: null, writes: w };
  }
  return {
    isrVector: "TIMER1_COMPA_vect",
    writes: [
      write("OCR1A", top, String(top), `interrupt every N*(1+OCR1A)/f = ${N}*${top + 1}/F_CPU`),
      write("TIMSK1", 1 << BIT.OCIE1A, bits(["OCIE1A"]), "compare A interrupt on"),
      write("TCCR1A", 0, "0", "pin driven by the interrupt, not by the timer"),
      write(
        "TCCR1B",
        (1 << BIT.WGM12) | cs,
        bits(["WGM12", ...csNames]),
        `CTC, TOP = OCR1A, clock = F_CPU/${N}; starts the timer`,
      ),
    ],
  };
}

export function atmega328pView(plan: BundlePlan): DeviceView {
  const t = plan.timer.toUpperCase();
  const r =
    t === "TIMER1"
      ? timer1(plan)
      : t === "TIMER0"
        ? avrTimer8(plan, { n: 0, cs: CS01, timsk: "TIMSK0", ocieBit: 1 })
        : t === "TIMER2"
          ? avrTimer8(plan, { n: 2, cs: CS2, timsk: "TIMSK2", ocieBit: 1 })
          : null;
  if (!r) throw new EngineError("unknown-timer", `atmega328p: no timer ${plan.timer}`);
  return avrDeviceView(plan, r.writes, r.isrVector);
}
