// The kept rate pot on the PIC12F1840: the bundle's image (src/main.asm plus
// src/adc_control.inc, built by the folder's own Makefile with gpasm) runs in
// gpsim (Debian gpsim 0.31, processor p12f1840) with a voltage on the wiper pin
// RA4/AN3 (gpsim's module library, tests/tools/gpsim.ts analogSource), and the
// CCP1 output on RA2 is sampled after every instruction.
// Expected values:
// - the period at a wiper position is the old stage's own: NE555 astable
//   (TI NE555 datasheet SLFS022, astable operation) T = ln 2 * (RA + 2 RB) * C,
//   high = ln 2 * (RA + RB) * C, with RB = series + track * fraction for a pot
//   wired as a divider (the fraction is Vwiper / VDD);
// - the ADC count of a voltage: DS40001441 ADC transfer function, count =
//   Vin / VDD * 1024 (gpsim scales by 1023; the test puts the voltage in the
//   middle of a 16-count step, so either gives the same step);
// - timing: DS40001441 CCP chapter, period = (PR2+1)*4*Tosc*prescale, the
//   clock decoded from the image's configuration words and OSCCON
//   (lib/firmware/emulate/harness/pic12f1840-tables.ts) because gpsim counts instruction cycles.
// Tolerance: one timer count of the plan (the "within one count"), plus the
// emulator's step (the pin is sampled once per instruction, at most two cycles).
// Planted faults kept as cases: wrong channel (CHS = AN2 in ADCON0), wrong table entry.
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { syntaxCheckFolder } from "@/tests/tools/c-check";
import { analogSource, buildPic, configWords, pinTiming, registersAt, tracePin } from "@/tests/tools/gpsim";
import { systemClockHz } from "@/tests/tools/pic12f1840-tables";
import type { BundleSpec } from "@/lib/bundle";

// 555 astable, 1 kOhm + (2.2 kOhm + 47 kOhm pot) + 10 nF: 37..690 us over the travel.
const RA = 1e3;
const SERIES = 2.2e3;
const TRACK = 47e3;
const C = 10e-9;
const VDD = 5;
const request: BundleTargetRequest = {
  device: "pic12f1840",
  clockSource: "hfintosc",
  clockHz: 16e6,
  periodS: 500e-6,
  highS: 260e-6,
  mode: "pwm",
  timer: "TIMER2",
};
const spec: BundleSpec = {
  retrofit: {
    name: "Dosing pump pulse stage",
    site: "Test bench",
    assetTag: "T-1",
    mainsPowered: false,
    drivesThyristor: false,
  },
  revision: 1,
  stage: { kind: "timer555-astable", supplyV: VDD, ra: RA, rb: 10e3, c: C },
  control: { kind: "pot", field: "rb", seriesR: SERIES, trackR: TRACK, taper: "linear" },
  targets: [request],
};
const files = buildBundleSources(spec);
const planJson = JSON.parse(String(files.find((f) => f.path === "plan.json")!.content)) as {
  targets: {
    plan: { divider: number; clockHz: number };
    control: { steps: number; periodCounts: number[] };
  }[];
};
const kept = planJson.targets[0].control;
const divider = planJson.targets[0].plan.divider;

/** The old stage at step k of 64 (fraction k/63 of the track): NE555 datasheet formulas. */
function oldStage(k: number): { periodS: number; highS: number } {
  const rb = SERIES + (TRACK * k) / 63;
  return { periodS: Math.LN2 * (RA + 2 * rb) * C, highS: Math.LN2 * (RA + rb) * C };
}

/** Period and high time on RA2 with the wiper at step k (voltage in the middle of its 16 counts). */
function measure(k: number, edit?: (asm: string) => string, incEdit?: (inc: string) => string) {
  const edited = incEdit
    ? files.map((f) =>
        f.path === "pic12f1840/src/adc_control.inc" ? { ...f, content: incEdit(String(f.content)) } : f,
      )
    : files;
  if (incEdit && edited.every((f, i) => f.content === files[i].content))
    throw new Error("planted fault changed nothing in adc_control.inc");
  const dir = buildPic(edited, "pic12f1840", edit);
  const volts = (VDD * (k * 16 + 8)) / 1024;
  const setup = analogSource("porta4", volts);
  const tcyPerCount = divider / 4;
  const longest = Math.max(...kept.periodCounts) * tcyPerCount;
  // start-up, the first conversion and two longest periods, then about four periods of step k
  const from = 3000 + 3 * longest;
  const steps = Math.ceil((4.5 * kept.periodCounts[k] * tcyPerCount) / 1.5);
  const samples = tracePin(dir, 2, from, steps, setup);
  const { OSCCON } = registersAt(dir, 1000, ["OSCCON"], setup);
  const { config1, config2 } = configWords(path.join(dir, "build/firmware.hex"));
  const hz = systemClockHz(config1, config2, OSCCON, 0);
  const t = pinTiming(samples);
  if (!t) return null;
  return { periodS: (t.periodCycles * 4) / hz, highS: (t.highCycles * 4) / hz, countS: divider / hz, hz };
}

function judge(k: number, edit?: (asm: string) => string, incEdit?: (inc: string) => string): string[] {
  const m = measure(k, edit, incEdit);
  if (!m) return [`step ${k}: no PWM on RA2`];
  const want = oldStage(k);
  const tol = m.countS + (2 * 4) / m.hz;
  const problems: string[] = [];
  if (Math.abs(m.periodS - want.periodS) > tol)
    problems.push(`step ${k}: period ${m.periodS} s, the old stage ${want.periodS} s (+-${tol})`);
  if (Math.abs(m.highS - want.highS) > tol)
    problems.push(`step ${k}: high ${m.highS} s, the old stage ${want.highS} s (+-${tol})`);
  return problems;
}

describe("PIC12F1840 kept rate pot in gpsim: AN3 on RA4, Timer2 + CCP1 PWM on RA2", () => {
  it("the bundle keeps the pot on this target with 64 steps and includes the part from main.asm and main.c", () => {
    expect(kept.steps).toBe(64);
    const asm = String(files.find((f) => f.path === "pic12f1840/src/main.asm")!.content);
    expect(asm).toContain('#include "adc_control.inc"');
    const c = String(files.find((f) => f.path === "pic12f1840/src/main.c")!.content);
    expect(c).toMatch(/adc_control_init\(\);\s*for \(;;\) \{\s*adc_control_poll\(\);/);
  });

  it("main.c with adc_control.h (the same steps for the vendor's C compiler) passes the syntax check against the DS40001441 stub", () => {
    const r = syntaxCheckFolder(files, "pic12f1840");
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
  });

  it("ADCON1 gives a TAD inside 1.0..6.0 us and VDD as reference; ADCON0 selects AN3", () => {
    // DS40001441 ADCON1: ADFM bit 7, ADCS<2:0> bits 6..4, ADPREF<1:0> bits 1..0; ADCON0: CHS<4:0> bits 6..2, ADON bit 0.
    // ADCS = 101 is Fosc/16 (ADC clock period table): 16 / 16 MHz = 1.0 us.
    const dir = buildPic(files, "pic12f1840");
    const r = registersAt(dir, 20000, ["ADCON0", "ADCON1", "ANSELA", "TRISA"], analogSource("porta4", 2.5));
    expect(r.ADCON1 & 0x80).toBe(0x80);
    expect((r.ADCON1 >> 4) & 7).toBe(0b101);
    expect(r.ADCON1 & 3).toBe(0);
    expect((r.ADCON0 >> 2) & 0x1f).toBe(3);
    expect(r.ADCON0 & 1).toBe(1);
    expect(r.ANSELA & 0x10).toBe(0x10);
    expect(r.TRISA & 0x10).toBe(0x10);
  });

  it.each([0, 32, 63])("wiper at step %i: period and high time are the old stage's within one count", (k) => {
    expect(judge(k)).toEqual([]);
  });

  it("planted fault: the ADC reads AN2 instead of AN3 (the output pin, not the wiper) is caught", () => {
    const wrongChannel = (inc: string) =>
      inc.replace(/movlw\s+0x0D\n(\s+movwf\s+ADCON0)/, "movlw   0x09\n$1");
    expect(judge(32, undefined, wrongChannel).join("; ")).toMatch(/step 32: period/);
  });

  it("planted fault: a wrong table entry (step 32's PR2 five counts long) is caught", () => {
    const pr2 = kept.periodCounts[32] - 1;
    let n = -1;
    const wrongEntry = (inc: string) =>
      inc.replace(/adj_pr2:\n\s+brw\n((?:\s+retlw\s+\d+.*\n)+)/, (block) =>
        block.replace(/retlw\s+(\d+)/g, (m, v: string) => {
          n++;
          return n === 32 && Number(v) === pr2 ? `retlw   ${pr2 + 5}` : m;
        }),
      );
    expect(judge(32, undefined, wrongEntry).join("; ")).toMatch(/step 32: period/);
  });
});
