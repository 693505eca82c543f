// The ATmega328P rate-pot firmware source (lib/bundle/adc-avr.ts) sets Timer1
// as its table's plan says; checked in the text, so the fast mutation set
// judges it (the simavr run is in tests/unit/firmware/adc-avr-simavr.test.ts).
import { describe, expect, it } from "vitest";
import { buildAdcTable } from "@/lib/engine";
import { renderAtmega328pAdc } from "@/lib/bundle/adc-avr";

describe("ATmega328P rate-pot firmware source", () => {
  it("Timer1 mode 14 with the clock select of the table's divider", () => {
    const table = buildAdcTable({
      stage: { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 },
      control: { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" },
      device: "atmega328p",
      clockHz: 16e6,
      adcBits: 10,
      steps: 64,
    });
    // ATmega328P datasheet, Timer/Counter1: WGM13:0 = 1110 is fast PWM with TOP = ICR1 (mode 14);
    // clock select CS12:0 = 001 /1, 010 /8, 011 /64, 100 /256, 101 /1024.
    const cs: Record<number, string> = {
      1: "(1 << CS10)",
      8: "(1 << CS11)",
      64: "(1 << CS11) | (1 << CS10)",
      256: "(1 << CS12)",
      1024: "(1 << CS12) | (1 << CS10)",
    };
    expect(cs[table.plan.divider]).toBeDefined();
    const source = renderAtmega328pAdc({ table, controlText: "rate pot as Rb" });
    expect(source).toContain(`TCCR1B = (1 << WGM13) | (1 << WGM12) | ${cs[table.plan.divider]};`);
  });
});
