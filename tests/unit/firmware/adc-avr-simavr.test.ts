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
import { avrAdcPrescaler, renderAtmega328pAdc, renderAttiny85Adc } from "@/lib/bundle/adc-avr";
import { buildAvrHex, runAvrWithAdc } from "@/tests/tools/simavr-adc";
import { measure } from "@/lib/firmware/emulate/harness/vcd";

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

// ATtiny85: Timer0 fast PWM mode 7 on OC0B (simavr 1.6 drives Timer0's outputs,
// not Timer1's), ADC1 on PB2 with VCC as reference (ATtiny25/45/85 datasheet,
// ADC chapter, ADMUX REFS2:0 = 000; ADC clock 50..200 kHz).
describe("ATtiny85 keeps the rate pot (simavr ADC input)", () => {
  const T85 = 8e6;
  const t85 = buildAdcTable({
    stage,
    control,
    device: "attiny85",
    clockHz: T85,
    clockSource: "rc8m",
    timer: "TIMER0",
    adcBits: 10,
    steps: 64,
  });
  const src85 = renderAttiny85Adc({ table: t85, controlText: "rate pot as Rb" });
  const count85 = t85.plan.divider / T85;

  function run85(src: string, k: number): number[] {
    const hex = buildAvrHex(src, "attiny85", T85);
    const cycles = (6 * t85.steps[k].periodS + 2e-3) * T85;
    const mv = Math.round((((k + 0.5) * t85.countsPerStep) / 1024) * AVCC_MV);
    const edges = runAvrWithAdc({
      hex,
      mcu: "attiny85",
      clockHz: T85,
      port: "B",
      bit: 1,
      cycles,
      channel: 1,
      millivolts: mv,
      avccMillivolts: AVCC_MV,
    });
    return measure(edges).periods.slice(1);
  }
  const judge = (periods: number[], k: number) => {
    const out: string[] = [];
    if (periods.length < 3) out.push(`only ${periods.length} periods`);
    for (const p of periods)
      if (Math.abs(p - t85.steps[k].wantS) > count85 + 1 / T85)
        out.push(`period ${p} s, stage ${t85.steps[k].wantS} s (step ${k})`);
    return out;
  };

  for (const k of [0, 32, 63])
    it(`period at step ${k} of 63 is the old stage's within one count`, () => {
      expect(judge(run85(src85, k), k)).toEqual([]);
    });

  it("planted fault: the wrong ADC channel is caught", () => {
    const bad = src85.replace("ADMUX = 1;", "ADMUX = 2;");
    expect(bad).not.toBe(src85);
    expect(judge(run85(bad, 63), 63).length).toBeGreaterThan(0);
  });
});
