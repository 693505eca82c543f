// The AVR firmware (ATmega328P, ATtiny85) that keeps the old stage's rate potentiometer: the
// wiper is read on an ADC pin and the engine's ADC table (buildAdcTable, the
// old stage's own law) sets Timer1's TOP and compare per step. Rendered from
// templates/atmega328p/adc-control.c.hbs. Facts: ATmega328P datasheet
// DS40002061, ADC chapter (ADMUX REFS, ADCSRA ADPS, "50 kHz and 200 kHz to get
// maximum resolution"), Timer/Counter1 chapter (mode 14, CS12:10).
import type { AdcTable } from "@/lib/engine";
import { adcClock } from "./adc-clock";
import { render } from "./render";

/** ADC clock range for 10-bit resolution (ADC chapter, prescaling); the rule itself is in adc-clock.ts. */
export const AVR_ADC_CLOCK_HZ = { min: 50e3, max: 200e3 } as const;
/** CS12:10 per Timer1 divider (Timer/Counter1 clock select table). */
const TIMER1_CS: Record<number, number> = { 1: 1, 8: 2, 64: 3, 256: 4, 1024: 5 };

/** The smallest ADC division that keeps the ADC clock at or below 200 kHz, if it is at or above 50 kHz. */
export function avrAdcPrescaler(clockHz: number): { div: number; bits: number; clockHz: number } {
  const c = adcClock("atmega328p", clockHz);
  return { div: c.divider, bits: c.bits, clockHz: c.adcClockHz };
}

function bitsExpr(value: number, names: readonly string[]): string {
  const parts = names.filter((_, i) => (value >> (names.length - 1 - i)) & 1).map((n) => `(1 << ${n})`);
  return parts.length ? parts.join(" | ") : "0";
}

/** Pot wiring for the pin map (ATmega328P pin tables, PDIP-28; from memory). */
export const ATMEGA328P_POT_WIRING = [
  { role: "supply (pot top)", pin: "AVCC", packagePin: 20 },
  { role: "wiper", pin: "PC0 (ADC0)", packagePin: 23 },
  { role: "ground (pot bottom)", pin: "GND", packagePin: 22 },
  { role: "filter capacitor 100 nF to ground", pin: "AREF", packagePin: 21 },
] as const;

export interface AvrAdcOptions {
  table: AdcTable;
  channel?: number;
  controlText: string;
}

export function renderAtmega328pAdc({ table, channel = 0, controlText }: AvrAdcOptions): string {
  const plan = table.plan;
  if (plan.device !== "atmega328p" || plan.timer !== "TIMER1" || plan.mode !== "pwm")
    throw new Error("The ADC control firmware runs on ATmega328P Timer1 fast PWM plans.");
  if (table.adcBits !== 10) throw new Error("adcBits: the ATmega328P ADC has 10 bits.");
  if (!Number.isInteger(channel) || channel < 0 || channel > 5)
    throw new Error("channel: the PDIP-28 ATmega328P has ADC0..ADC5 on PC0..PC5.");
  const cs = TIMER1_CS[plan.divider];
  if (!cs) throw new Error(`divider ${plan.divider} is not a Timer1 clock select.`);
  const adc = avrAdcPrescaler(plan.clockHz);
  const last = table.steps.length - 1;
  return render("atmega328p/adc-control.c.hbs", {
    deviceName: "ATmega328P",
    controlText,
    clockHz: plan.clockHz,
    divider: plan.divider,
    csExpr: bitsExpr(cs, ["CS12", "CS11", "CS10"]),
    countsPerStep: table.countsPerStep,
    hysteresis: table.hysteresisCounts,
    adc: {
      channel,
      pin: `PC${channel}`,
      bits: table.adcBits,
      prescaler: adc.div,
      clockHz: adc.clockHz,
      adpsExpr: bitsExpr(adc.bits, ["ADPS2", "ADPS1", "ADPS0"]),
    },
    steps: table.steps.map((s) => ({
      top: s.periodCounts - 1,
      ocr: s.highCounts - 1,
      note:
        s.index === 0 ? "minimum" : s.index === last ? "maximum" : s.index === last / 2 + 0.5 ? "middle" : "",
    })),
  });
}

/** ATtiny85 pot wiring (ATtiny25/45/85 pin configuration, PDIP-8/SOIC-8; from memory). */
export const ATTINY85_POT_WIRING = [
  { role: "supply (pot top)", pin: "VCC", packagePin: 8 },
  { role: "wiper", pin: "PB2 (ADC1)", packagePin: 7 },
  { role: "ground (pot bottom)", pin: "GND", packagePin: 4 },
  { role: "filter capacitor 100 nF from the wiper to ground", pin: "PB2", packagePin: 7 },
] as const;

/** ADC channel -> pin on the ATtiny85 (ADC0 is the reset pin, not offered). */
const TINY_ADC_PINS: Record<number, string> = { 1: "PB2", 2: "PB4", 3: "PB3" };

export function renderAttiny85Adc({ table, channel = 1, controlText }: AvrAdcOptions): string {
  const plan = table.plan;
  if (plan.device !== "attiny85" || plan.timer !== "TIMER0" || plan.mode !== "pwm")
    throw new Error("The ADC control firmware runs on ATtiny85 Timer0 fast PWM plans.");
  if (table.adcBits !== 10) throw new Error("adcBits: the ATtiny85 ADC has 10 bits.");
  const pin = TINY_ADC_PINS[channel];
  if (!pin) throw new Error("channel: use ADC1 (PB2), ADC2 (PB4) or ADC3 (PB3); ADC0 shares the reset pin.");
  const adc = avrAdcPrescaler(plan.clockHz);
  const last = table.steps.length - 1;
  return render("attiny85/adc-control.c.hbs", {
    deviceName: "ATtiny85",
    controlText,
    clockHz: plan.clockHz,
    divider: plan.divider,
    tccr0a: plan.registers.TCCR0A,
    tccr0b: plan.registers.TCCR0B,
    countsPerStep: table.countsPerStep,
    hysteresis: table.hysteresisCounts,
    adc: {
      channel,
      pin,
      bits: table.adcBits,
      prescaler: adc.div,
      clockHz: adc.clockHz,
      adpsExpr: bitsExpr(adc.bits, ["ADPS2", "ADPS1", "ADPS0"]),
    },
    steps: table.steps.map((s) => ({
      top: s.periodCounts - 1,
      ocr: s.highCounts - 1,
      note: s.index === 0 ? "minimum" : s.index === last ? "maximum" : "",
    })),
  });
}
