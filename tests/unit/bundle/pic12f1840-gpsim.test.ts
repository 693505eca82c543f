// The PIC12F1840 image (built from the bundle's src/main.asm by its own
// Makefile) runs in gpsim (Debian gpsim 0.31, processor p12f1840). Expected
// values are the REQUESTED period and high time; the clock is decoded from
// the image's configuration words and the OSCCON value gpsim ends with
// (lib/firmware/emulate/harness/pic12f1840-tables.ts, DS40001441 Registers 4-1, 4-2, 5-1),
// because gpsim counts instruction cycles (Fosc/4) and does not model time.
// Tolerance: half a timer count (firmware.md build contract) plus the
// emulator's own step: the pin is sampled once per instruction, and the
// idle loop's `goto` takes two cycles; averaged over the periods seen.
// PWM timing formulas: DS40001441 CCP chapter, period = (PR2+1)*4*Tosc*prescale,
// pulse = CCPR1L:DC1B*Tosc*prescale.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundlePlan, type BundleTargetRequest } from "@/lib/bundle";
import { buildPic, latchWrites, pinTiming, registersAt, tracePin, configWords } from "@/tests/tools/gpsim";
import { systemClockHz } from "@/tests/tools/pic12f1840-tables";
import { spec } from "./fixtures";

interface Case {
  /** clockSource passes through BundleSpec.targets to the engine unchanged (firmware.md). */
  request: BundleTargetRequest & { clockSource: string };
  files: ReturnType<typeof buildBundleSources>;
  plan: BundlePlan;
  /** Frequency on OSC1/CLKIN (crystal plans); 0 for the internal oscillator. */
  boardHz: number;
}

function bundle(request: Case["request"], boardHz = 0): Case {
  const files = buildBundleSources(spec([request]));
  const planJson = JSON.parse(String(files.find((f) => f.path === "plan.json")!.content)) as {
    targets: { plan: BundlePlan }[];
  };
  return { request, files, plan: planJson.targets[0].plan, boardHz };
}

function clockOf(c: Case, dir: string, osccon: number): number {
  const { config1, config2 } = configWords(path.join(dir, "build/firmware.hex"));
  return systemClockHz(config1, config2, osccon, c.boardHz);
}

/** Problems with a PWM image's pin timing against the request; [] = within tolerance. */
function judgePwm(c: Case, edit?: (asm: string) => string): string[] {
  const dir = buildPic(c.files, "pic12f1840", edit);
  const bit = c.plan.pin.bit ?? Number.NaN;
  const countS = c.plan.divider / c.plan.clockHz;
  // Start after the oscillator wait and one Timer2 period; sample up to 12
  // periods (at most 4000 instructions, each at most two cycles).
  const periodCycles = (c.request.periodS * c.plan.clockHz) / 4;
  const periods = Math.max(3, Math.min(12, Math.floor(8000 / periodCycles)));
  const samples = tracePin(dir, bit, 2000 + 2 * periodCycles, Math.ceil(((periods + 1) * periodCycles) / 2));
  const end = samples[samples.length - 1].cycle;
  const { OSCCON } = registersAt(dir, end, ["OSCCON"]);
  const hz = clockOf(c, dir, OSCCON);
  const t = pinTiming(samples);
  if (!t) return [`no PWM on RA${bit}: the pin did not toggle in ${end} cycles`];
  const tcy = 4 / hz;
  const problems: string[] = [];
  const periodS = t.periodCycles * tcy;
  const highS = t.highCycles * tcy;
  const periodTol = 0.5 * countS + (2 * tcy) / t.periods;
  const highTol = 0.5 * countS + 2 * tcy;
  if (Math.abs(periodS - c.request.periodS) > periodTol)
    problems.push(`period ${periodS} s, requested ${c.request.periodS} s (+-${periodTol})`);
  if (Math.abs(highS - c.request.highS) > highTol)
    problems.push(`high ${highS} s, requested ${c.request.highS} s (+-${highTol})`);
  return problems;
}

/** Problems with an interrupt image: interrupt interval and pin period/high from the LATA writes. */
function judgeIsr(c: Case, edit?: (asm: string) => string): string[] {
  const dir = buildPic(c.files, "pic12f1840", edit);
  const mask = 1 << (c.plan.pin.bit ?? Number.NaN);
  const intervalCycles = (c.plan.divider * c.plan.periodCounts) / 4;
  const run = Math.round(intervalCycles * (3 * c.plan.softwareDivider + 4)) + 2000;
  const writes = latchWrites(dir, run).slice(1); // the first is the start-up clear
  const { OSCCON } = registersAt(dir, 1000, ["OSCCON"]);
  const hz = clockOf(c, dir, OSCCON);
  const tcy = 4 / hz;
  if (writes.length < 2) return ["no Timer2 interrupts: LATA was never written by the handler"];
  const problems: string[] = [];
  const gaps = writes.slice(1).map((w, i) => w.cycle - writes[i].cycle);
  // The handler writes LATA a fixed number of cycles after entry: every gap is one interrupt interval.
  const interval = gaps[0];
  if (gaps.some((g) => g !== interval))
    problems.push(`interrupt intervals differ: ${[...new Set(gaps)].join(", ")}`);
  const wantInterval = (c.request.periodS / c.plan.softwareDivider) * (hz / 4);
  if (Math.abs(interval - wantInterval) > (0.5 * c.plan.divider) / 4)
    problems.push(
      `interrupt every ${interval} cycles, requested period / software divider = ${wantInterval}`,
    );
  const level = writes.map((w) => ((w.value & mask) !== 0 ? 1 : 0));
  const rises = writes.filter((w, i) => i > 0 && level[i] === 1 && level[i - 1] === 0).map((w) => w.cycle);
  const falls = writes.filter((w, i) => i > 0 && level[i] === 0 && level[i - 1] === 1).map((w) => w.cycle);
  if (rises.length < 2) return [...problems, `RA${c.plan.pin.bit} did not rise twice`];
  const periodS = (rises[1] - rises[0]) * tcy;
  const fall = falls.find((f) => f > rises[0])!;
  const highS = (fall - rises[0]) * tcy;
  // Half a count of each of the software divider's intervals (the solver's step for the whole period).
  const tol = (0.5 * c.plan.softwareDivider * c.plan.divider) / c.plan.clockHz;
  if (Math.abs(periodS - c.request.periodS) > tol)
    problems.push(`period ${periodS} s, requested ${c.request.periodS} s (+-${tol})`);
  if (Math.abs(highS - c.request.highS) > tol)
    problems.push(`high ${highS} s, requested ${c.request.highS} s (+-${tol})`);
  return problems;
}

// Planted faults: each edits the generated src/main.asm before the build.
const pr2OffByOne = (asm: string) =>
  asm.replace(
    /(movlw\s+)(\d+)(\n\s+movwf\s+PR2\b)/,
    (_m, a: string, v: string, b: string) => `${a}${Number(v) + 1}${b}`,
  );
const timer2NeverStarted = (asm: string) =>
  asm.replace(
    /(movlw\s+)0x0([4-7])(\n\s+movwf\s+T2CON\b)/,
    (_m, a: string, v: string, b: string) => `${a}0x0${Number(v) - 4}${b}`,
  );
const oscconNotWritten = (asm: string) =>
  asm.replace(/\n\s+banksel OSCCON\n\s+movlw\s+\S+\n\s+movwf\s+OSCCON\n/, "\n");

// 16 MHz internal: Tcy 250 ns; 25 us = 100 Tcy (PR2 = 99, prescale 1), 6 us = 24 Tcy.
const pwmFast = bundle({
  device: "pic12f1840",
  clockSource: "hfintosc",
  clockHz: 16e6,
  periodS: 25e-6,
  highS: 6e-6,
});
// 8 MHz crystal (HS), prescale 16: 1 ms = 125 counts, 0.3 ms = 37.5 counts (DC1B quarter counts).
const pwmCrystal = bundle(
  { device: "pic12f1840", clockSource: "crystal", clockHz: 8e6, periodS: 1e-3, highS: 0.3e-3 },
  8e6,
);
// 16 MHz internal, interrupt plan with a software divider.
const isr = bundle({
  device: "pic12f1840",
  clockSource: "hfintosc",
  clockHz: 16e6,
  periodS: 10e-3,
  highS: 2.5e-3,
  mode: "isr",
});

describe("PIC12F1840 image in gpsim: Timer2 + CCP1 PWM on RA2", () => {
  it("the plans under test are what the comments say", () => {
    expect(pwmFast.plan).toMatchObject({ mode: "pwm", divider: 4, periodCounts: 100, highCounts: 24 });
    expect(pwmCrystal.plan).toMatchObject({ mode: "pwm", divider: 64, periodCounts: 125, highCounts: 37.5 });
    expect(isr.plan.mode).toBe("isr");
    expect(isr.plan.softwareDivider).toBeGreaterThan(1);
  });

  it("16 MHz internal oscillator: period and high time on the pin match the request", () => {
    expect(judgePwm(pwmFast)).toEqual([]);
  });

  it("8 MHz crystal, prescale 16, quarter-count duty: period and high time match the request", () => {
    expect(judgePwm(pwmCrystal)).toEqual([]);
  });

  it("planted fault PR2 off by one is caught", () => {
    expect(judgePwm(pwmFast, pr2OffByOne).join("; ")).toMatch(/^period /);
  });

  it("planted fault Timer2 never started is caught", () => {
    expect(judgePwm(pwmFast, timer2NeverStarted).join("; ")).toMatch(/no PWM on RA2/);
  });

  it("planted fault OSCCON not written (runs at the 500 kHz reset clock) is caught", () => {
    expect(judgePwm(pwmFast, oscconNotWritten).join("; ")).toMatch(/period .*high /);
  });
});

describe("PIC12F1840 image in gpsim: Timer2 interrupt plan", () => {
  it("interrupt interval, period and high time on RA2 match the request", () => {
    expect(judgeIsr(isr)).toEqual([]);
  });

  it("planted fault PR2 off by one is caught", () => {
    expect(judgeIsr(isr, pr2OffByOne).join("; ")).toMatch(/interrupt every/);
  });

  it("planted fault Timer2 never started is caught", () => {
    expect(judgeIsr(isr, timer2NeverStarted)).toEqual([
      "no Timer2 interrupts: LATA was never written by the handler",
    ]);
  });

  it("planted fault OSCCON not written is caught", () => {
    expect(judgeIsr(isr, oscconNotWritten).join("; ")).toMatch(/period /);
  });
});

describe("PIC12F1840 image source", () => {
  it("the image the tests ran is the bundle's own src/main.asm", () => {
    const asm = pwmFast.files.find((f) => f.path === "pic12f1840/src/main.asm");
    expect(String(asm?.content)).toContain("#include <p12f1840.inc>");
    expect(readFileSync(path.join(buildPic(pwmFast.files, "pic12f1840"), "src/main.asm"), "utf8")).toBe(
      asm?.content,
    );
  });
});
