// A kept rate potentiometer on the ATmega328P, run in simavr (Debian libsimavr
// 1.6; its ADC model takes millivolts on each input, avr_adc.h). The wiper
// voltage is set to the middle of the ADC step for minimum, middle and maximum
// rotation; the OC1A (PB1) period must equal the old stage's period at that
// rotation within one timer count plus one CPU cycle (firmware.md, "Timing of
// an image"). Old stage: 555 astable, T = ln2*(Ra + 2*Rb)*C (NE555 datasheet,
// TI SLFS022), Rb = the pot. ADC set-up: ATmega328P datasheet DS40002061, ADC
// chapter (AVcc reference REFS1:0 = 01, ADC clock 50..200 kHz).
// Planted faults (kept as negative cases): the wrong ADC channel, and the
// wrong law (the table read back to front).
import { describe, expect, it } from "vitest";
import { buildAdcTable, type Stage } from "@/lib/engine";
import { avrAdcPrescaler, renderAtmega328pAdc } from "@/lib/bundle/adc-atmega328p";
import { buildAvrHex, runAvrWithAdc } from "@/tests/tools/simavr-adc";
import { measure } from "@/tests/tools/vcd";

const CLOCK = 16e6;
const AVCC_MV = 5000;
const stage: Stage = { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 };
const control = { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;
const table = buildAdcTable({ stage, control, device: "atmega328p", clockHz: CLOCK, adcBits: 10, steps: 64 });
const source = renderAtmega328pAdc({ table, controlText: "rate pot as Rb, 47 kohm linear + 2.2 kohm" });
const countS = table.plan.divider / CLOCK;

/** Millivolts at the middle of a step's ADC counts (ADC = Vin*1024/Vref, datasheet ADC conversion result). */
const stepMillivolts = (k: number) => Math.round((((k + 0.5) * table.countsPerStep) / 1024) * AVCC_MV);

function periodsAt(src: string, k: number): number[] {
  const hex = buildAvrHex(src, "atmega328p", CLOCK);
  const cycles = (6 * table.steps[k].periodS + 2e-3) * CLOCK;
  const edges = runAvrWithAdc({
    hex,
    mcu: "atmega328p",
    clockHz: CLOCK,
    port: "B",
    bit: 1,
    cycles,
    channel: 0,
    millivolts: stepMillivolts(k),
    avccMillivolts: AVCC_MV,
  });
  // the first period may still carry the start-up reading: judge the later ones
  return measure(edges).periods.slice(1);
}

function problems(periods: number[], k: number): string[] {
  const want = table.steps[k].wantS;
  const out: string[] = [];
  if (periods.length < 3) out.push(`only ${periods.length} periods`);
  for (const p of periods)
    if (Math.abs(p - want) > countS + 1 / CLOCK) out.push(`period ${p} s, stage ${want} s (step ${k})`);
  return out;
}

describe("ATmega328P keeps the rate pot (simavr ADC input)", () => {
  it("sets the ADC clock inside 50..200 kHz (datasheet ADC prescaling)", () => {
    expect(avrAdcPrescaler(16e6)).toEqual({ div: 128, bits: 7, clockHz: 125e3 });
    expect(avrAdcPrescaler(1e6)).toEqual({ div: 8, bits: 3, clockHz: 125e3 });
    expect(() => avrAdcPrescaler(32768)).toThrow(/clockHz/);
    expect(source).toContain("ADMUX = (1 << REFS0) | 0;");
    expect(source).toContain("(1 << ADPS2) | (1 << ADPS1) | (1 << ADPS0)");
  });

  for (const [name, k] of [
    ["minimum", 0],
    ["middle", 32],
    ["maximum", 63],
  ] as const)
    it(`period at ${name} rotation is the old stage's within one count`, () => {
      expect(problems(periodsAt(source, k), k)).toEqual([]);
    });

  it("planted fault: the wrong ADC channel is caught", () => {
    const bad = source.replace("ADMUX = (1 << REFS0) | 0;", "ADMUX = (1 << REFS0) | 1;");
    expect(bad).not.toBe(source);
    expect(problems(periodsAt(bad, 32), 32).length).toBeGreaterThan(0);
  });

  it("planted fault: the wrong law (table read back to front) is caught", () => {
    const bad = source.replace(
      /pgm_read_word\(&adj_(top|ocr)\[step\]\)/g,
      "pgm_read_word(&adj_$1[ADJ_STEPS - 1u - step])",
    );
    expect(bad).not.toBe(source);
    expect(problems(periodsAt(bad, 63), 63).length).toBeGreaterThan(0);
  });
});
