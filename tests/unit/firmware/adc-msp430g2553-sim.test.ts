// The kept rate pot on the MSP430G2553: the bundle's image (src/main.c with
// src/adc_control.h, built by the folder's own Makefile with Debian's clang,
// lld and msp430mcu) runs in mspdebug's simulator (Debian mspdebug 0.22).
// What the simulator lacks, and how each part is checked instead:
// - it has no ADC10: the conversion result is put at ADC10MEM (0x01B4) before
//   the run (a byte written there stays), so the image's own reading, step
//   rule and table lookup run on it; the ADC set-up (reference, clock,
//   sample time, channel, analog enable) is checked from the IO writes the
//   image makes (the tracer's history) against SLAU144's ADC10 register bits;
// - it has no Timer_A output unit: the period is the running counter's (TAR
//   sampled, tests/tools/mspdebug-sim.ts periodsFromSamples) and the high time
//   is TA0CCR1 in OUTMOD_7 (SLAU144 Timer_A, output mode 7 reset/set).
// Expected values: the old stage's own period at the wiper position, NE555
// astable (TI NE555 datasheet SLFS022, astable operation) T = ln 2 * (RA + 2 RB) * C,
// high = ln 2 * (RA + RB) * C, RB = series + track * fraction (pot as divider);
// ADC10 count = 1023 * Vin / VCC (SLAU144 ADC10 chapter, conversion formula), put
// in the middle of a 16-count step. Tolerance: one timer count of the plan.
// Planted faults kept as cases: wrong channel (INCH_5), wrong table entry.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleFile, type BundleSpec } from "@/lib/bundle";
import { buildMsp430, type Plant } from "@/tests/tools/msp430-build";
import { lastWrite, periodsFromSamples, sampleTimer } from "@/tests/tools/mspdebug-sim";

const RA = 1e3;
const SERIES = 2.2e3;
const TRACK = 47e3;
const C = 100e-9;
const spec: BundleSpec = {
  retrofit: {
    name: "Dosing pump pulse stage",
    site: "Test bench",
    assetTag: "T-1",
    mainsPowered: false,
    drivesThyristor: false,
  },
  revision: 1,
  stage: { kind: "timer555-astable", supplyV: 5, ra: RA, rb: 10e3, c: C },
  control: { kind: "pot", field: "rb", seriesR: SERIES, trackR: TRACK, taper: "linear" },
  targets: [{ device: "msp430g2553", clockHz: 1e6, periodS: 1.4556e-3, highS: 7.624e-4, mode: "pwm" }],
};
const files: BundleFile[] = buildBundleSources(spec);
const planJson = JSON.parse(String(files.find((f) => f.path === "plan.json")!.content)) as {
  targets: {
    plan: { divider: number; clockHz: number };
    control: { steps: number; periodCounts: number[]; highCounts: number[] };
  }[];
};
const kept = planJson.targets[0].control;
const { divider, clockHz } = planJson.targets[0].plan;
const countS = divider / clockHz;

// SLAS735 peripheral file map: ADC10AE0 0x004A, ADC10CTL0 0x01B0, ADC10CTL1 0x01B2, ADC10MEM 0x01B4.
const ADC10AE0 = 0x4a;
const ADC10CTL0 = 0x1b0;
const ADC10CTL1 = 0x1b2;
const ADC10MEM = 0x1b4;

function oldStage(k: number): { periodS: number; highS: number } {
  const rb = SERIES + (TRACK * k) / 63;
  return { periodS: Math.LN2 * (RA + 2 * rb) * C, highS: Math.LN2 * (RA + rb) * C };
}

function build(plant?: Plant): string {
  const b = buildMsp430(files, "msp430g2553", plant);
  if (b.make.status !== 0) throw new Error(`make failed:\n${b.make.stderr}${b.make.stdout}`);
  return b.elf;
}

const wiper = (count: number) => ({ memory: [{ addr: ADC10MEM, bytes: [count & 0xff, count >> 8] }] });

/** Timer samples at step k: past start-up and the first period wait, then about four periods. */
function run(k: number, plant?: Plant) {
  const longest = Math.max(...kept.periodCounts) * divider;
  // a sample spacing below the step's period, odd so the samples walk over the count
  const spacing = 2 * Math.floor((kept.periodCounts[k] * divider) / 6) + 1;
  return sampleTimer(build(plant), 2 * longest + 3000, spacing, 12, wiper(k * 16 + 8)).samples;
}

/** The ADC registers the image writes at start-up (the tracer keeps the last 4096 IO events: a short run). */
function adcWrites(plant?: Plant) {
  const { io } = sampleTimer(build(plant), 3000, 97, 1, wiper(520));
  const get = (addr: number) => {
    const v = lastWrite(io, addr);
    if (v === undefined) throw new Error(`no write to 0x${addr.toString(16)} in the first 3000 steps`);
    return v;
  };
  return { ctl0: get(ADC10CTL0), ctl1: get(ADC10CTL1), ae0: get(ADC10AE0) };
}

/** What disagrees with the old stage at step k (empty = agrees within one count). */
function judge(k: number, plant?: Plant): string[] {
  const samples = run(k, plant);
  const periods = periodsFromSamples(samples, 1);
  const last = samples[samples.length - 1];
  const want = oldStage(k);
  const out: string[] = [];
  if (periods.length < 2 || periods.some((p) => p !== periods[0]))
    return [`step ${k}: counter periods ${periods.join(", ")}`];
  const periodS = periods[0] * countS;
  if (periods[0] !== last.ccr[0] + 1)
    out.push(`step ${k}: counter wraps at ${periods[0]}, TA0CCR0 ${last.ccr[0]}`);
  if (Math.abs(periodS - want.periodS) > countS)
    out.push(`step ${k}: period ${periodS} s, the old stage ${want.periodS} s`);
  const highS = last.ccr[1] * countS;
  if (Math.abs(highS - want.highS) > countS)
    out.push(`step ${k}: high ${highS} s, the old stage ${want.highS} s`);
  return out;
}

describe("MSP430G2553 kept rate pot: ADC10 on A4 (P1.4), Timer0_A3 PWM", () => {
  it("main.c includes adc_control.h and polls it instead of sleeping", () => {
    const m = String(files.find((f) => f.path === "msp430g2553/src/main.c")!.content);
    expect(m).toContain('#include "adc_control.h"');
    expect(m).toMatch(/adc_control_init\(\);\s*for \(;;\) \{\s*adc_control_poll\(\);/);
    expect(kept.steps).toBe(64);
  });

  it("ADC10 set-up from the image's IO writes: VCC reference, SMCLK/1, 64-cycle sample, A4, P1.4 analog", () => {
    const { ctl0, ctl1, ae0 } = adcWrites();
    // SLAU144 ADC10CTL1: INCHx 15..12, SHSx 11..10, ADC10DF 9, ISSH 8, ADC10DIVx 7..5, ADC10SSELx 4..3 (11 = SMCLK), CONSEQx 2..1
    expect(ctl1 >> 12).toBe(4);
    expect((ctl1 >> 10) & 3).toBe(0);
    expect((ctl1 >> 5) & 7).toBe(0); // 1 MHz SMCLK / 1 is inside the ADC10CLK range
    expect((ctl1 >> 3) & 3).toBe(3);
    expect((ctl1 >> 1) & 3).toBe(0);
    // ADC10CTL0: SREFx 15..13 (000 = VCC/VSS), ADC10SHTx 12..11 (11 = 64 cycles), ADC10ON 4, ENC 1, ADC10SC 0
    expect(ctl0 >> 13).toBe(0);
    expect((ctl0 >> 11) & 3).toBe(3);
    expect(ctl0 & 0x10).toBe(0x10);
    expect(ctl0 & 0x03).toBe(0x03);
    // ADC10AE0: bit n enables An on P1.n
    expect(ae0).toBe(0x10);
  });

  it.each([0, 32, 63])("wiper at step %i: period and high time are the old stage's within one count", (k) => {
    expect(judge(k)).toEqual([]);
  });

  it("planted fault: the ADC set up on A5 instead of A4 is caught by the register check", () => {
    const { ctl1 } = adcWrites({ file: "src/adc_control.h", from: "INCH_4", to: "INCH_5" });
    expect(ctl1 >> 12).toBe(5);
  });

  it("planted fault: a wrong table entry (step 32's TA0CCR0 five counts long) is caught", () => {
    const ccr0 = kept.periodCounts[32] - 1;
    const plant: Plant = {
      file: "src/adc_control.h",
      from: new RegExp(`(adj_ccr0\\[ADJ_STEPS\\] = \\{\\n(?:\\s+\\d+u,.*\\n){32}\\s+)${ccr0}u`),
      to: `$1${ccr0 + 5}u`,
    };
    expect(judge(32, plant).join("; ")).toMatch(/step 32: period/);
  });
});
