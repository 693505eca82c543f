// MSP430G2553 images run in mspdebug's simulator (Debian mspdebug 0.22).
// Expected values: MSP430x2xx Family User's Guide SLAU144, Timer_A chapter
// (up mode: the timer counts 0..TACCR0, so a period is TACCR0+1 counts of the
// input clock divided by ID; TACCR0 CCIFG interrupt once per period; OUTMOD_7
// reset/set: high for TACCR1 counts) and Basic Clock Module+ chapter (DCOCTL
// written 0 before BCSCTL1, LFXT1S/XCAP in BCSCTL3); MSP430G2x53 datasheet
// SLAS735 (register addresses, calibration data at 0x10F8..0x10FF).
// The simulator has no Timer_A output unit: PWM output is judged from the
// running timer's registers and its counter; interrupt plans from the
// interrupt times and the P1 levels the handler writes (gpio device).
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundlePlan, type BundleTargetRequest } from "@/lib/bundle";
import { buildMsp430, type Msp430Build, type Plant } from "@/tests/tools/msp430-build";
import {
  SIM_CALIBRATION,
  countEvents,
  lastWrite,
  periodsFromSamples,
  runToBreaks,
  sampleTimer,
  type IoWrite,
  type SimOptions,
} from "@/tests/tools/mspdebug-sim";
import { spec } from "./fixtures";

const PWM_1M: BundleTargetRequest = { device: "msp430g2553", clockHz: 1e6, periodS: 0.02, highS: 0.0015 };
const PWM_16M: BundleTargetRequest = { device: "msp430g2553", clockHz: 16e6, periodS: 0.03, highS: 0.01 };
const ISR_1M: BundleTargetRequest = {
  device: "msp430g2553",
  clockHz: 1e6,
  periodS: 2,
  highS: 0.5,
  mode: "isr",
};
const ISR_XT: BundleTargetRequest = {
  device: "msp430g2553",
  clockHz: 32768,
  periodS: 1,
  highS: 0.25,
  mode: "isr",
  clockSource: "lfxt1",
};

// Register addresses: SLAS735 peripheral file map (same as msp430mcu's periph.x)
const WDTCTL = 0x120;
const DCOCTL = 0x56;
const BCSCTL1 = 0x57;
const BCSCTL3 = 0x53;
const P1DIR = 0x22;
const P1SEL = 0x26;
const P1SEL2 = 0x41;
const P2SEL = 0x2e;
const P2SEL2 = 0x42;
/** Longest MSP430 instruction / interrupt acceptance: 6 cycles (SLAU144 CPU chapter). */
const EMU_STEP_CYCLES = 6;
/** mspdebug's simulator runs ACLK at SMCLK/256 (seen in its tracer counters; it has no clock module). */
const SIM_SMCLK_PER_ACLK = 256;
// Timer_A status bits that the hardware sets: TAIFG (TACTL bit 0); CCIFG, COV, CCI, SCCI (TACCTLx bits 0, 1, 3, 10)
const TACTL_FLAGS = 0x0001;
const TACCTL_FLAGS = 0x0001 | 0x0002 | 0x0008 | 0x0400;

interface Image {
  plan: BundlePlan;
  request: BundleTargetRequest;
  build: Msp430Build;
}

function image(request: BundleTargetRequest, plant?: Plant): Image {
  const files = buildBundleSources(spec([request]));
  const planJson = JSON.parse(files.find((f) => f.path === "plan.json")!.content as string) as {
    targets: { plan: BundlePlan }[];
  };
  const build = buildMsp430(files, "msp430g2553", plant);
  if (build.make.status !== 0) throw new Error(`make failed:\n${build.make.stderr}${build.make.stdout}`);
  return { plan: planJson.targets[0].plan, request, build };
}

const aclkTimer = (p: BundlePlan) => p.clockSource === "lfxt1" || p.clockSource === "external";

/** The clock set-up the plan names, from the image's IO writes in order. */
function clockFindings(p: BundlePlan, io: IoWrite[]): string[] {
  const out: string[] = [];
  if (!(io[0]?.addr === WDTCTL && io[0].value === 0x5a80))
    out.push("the first IO write does not hold the watchdog");
  if (p.clockSource === "dco-cal") {
    // SLAS735 calibration bytes: CALDCO_16MHZ at 0x10F8, CALBC1_16MHZ 0x10F9, 12 MHz 0x10FA/B, 8 MHz 0x10FC/D, 1 MHz 0x10FE/F
    const slot = { 16: 0, 12: 2, 8: 4, 1: 6 }[p.clockHz / 1e6]!;
    const dcoWrites = io.filter((w) => w.addr === DCOCTL || w.addr === BCSCTL1).map((w) => [w.addr, w.value]);
    const want = [
      [DCOCTL, 0],
      [BCSCTL1, SIM_CALIBRATION[slot + 1]],
      [DCOCTL, SIM_CALIBRATION[slot]],
    ];
    if (JSON.stringify(dcoWrites) !== JSON.stringify(want))
      out.push(`DCO set-up writes ${JSON.stringify(dcoWrites)}, want ${JSON.stringify(want)}`);
  } else {
    const b3 = lastWrite(io, BCSCTL3);
    const want = p.clockSource === "lfxt1" ? 0x0c : 0x30; // LFXT1S_0|XCAP_3 or LFXT1S_3|XCAP_0
    if (b3 !== want) out.push(`BCSCTL3 = ${String(b3)}, want ${want}`);
    if (((lastWrite(io, P2SEL) ?? 0) & 0xc0) !== 0xc0) out.push("P2SEL.6/7 not set for XIN/XOUT");
    if (((lastWrite(io, P2SEL2) ?? 0xff) & 0xc0) !== 0) out.push("P2SEL2.6/7 not cleared");
    if (((lastWrite(io, BCSCTL1) ?? 0) & 0x40) !== 0) out.push("XTS set: the G2553 has no LFXT1 HF mode");
    if (io.some((w) => w.addr === DCOCTL)) out.push("DCO written although the plan runs from LFXT1");
  }
  return out;
}

function timerRegisterFindings(img: Image, o: SimOptions = {}): string[] {
  // past start-up, including the LFXT1 fault-flag wait (about 15000 cycles)
  const { samples } = sampleTimer(img.build.elf, 100_000, 97, 1, o);
  const s = samples[samples.length - 1];
  const running: Record<string, number> = {
    TACTL: s.tactl & ~TACTL_FLAGS,
    TACCR0: s.ccr[0],
    TACCR1: s.ccr[1],
    TACCTL0: s.cctl[0] & ~TACCTL_FLAGS,
    TACCTL1: s.cctl[1] & ~TACCTL_FLAGS,
  };
  const out: string[] = [];
  for (const [k, v] of Object.entries(img.plan.registers))
    if (running[k] !== v) out.push(`${k}: plan.json ${v}, running ${running[k]}`);
  // registers the plan leaves out must be in their reset state (0) apart from status flags
  for (const k of ["TACCTL0", "TACCTL1"])
    if (!(k in img.plan.registers) && running[k] !== 0)
      out.push(`${k} = ${running[k]} but plan.json has none`);
  return out;
}

/** Interrupt plan: returns what disagrees with the plan and the request (empty = agrees). */
function isrFindings(img: Image, o: SimOptions = {}): string[] {
  const p = img.plan;
  const interval = p.divider * p.periodCounts; // SLAU144: ID*(TACCR0+1) timer clocks per interrupt
  const smclkPerTick = aclkTimer(p) ? SIM_SMCLK_PER_ACLK : 1;
  const pre = countEvents(img.build.elf, 3 * interval * smclkPerTick + 50_000, 9, o);
  const out = clockFindings(p, pre.io);
  if (pre.resets > 0) out.push(`CPU reset ${pre.resets} times (watchdog not held?)`);
  if (pre.irqs < 2) out.push(`only ${pre.irqs} timer interrupts in 3 planned intervals`);
  if (out.length > 0) return out;
  const stops = 2 * p.softwareDivider + 2;
  const { stops: seen } = runToBreaks(img.build.elf, "timing_isr", "reset_entry", stops, o);
  const t = seen.map((s) => (aclkTimer(p) ? s.aclk : s.smclk));
  const step = aclkTimer(p) ? 1 : EMU_STEP_CYCLES;
  const half = p.divider / 2; // half a timer count, in timer clocks
  const gaps = t.slice(1).map((x, i) => x - t[i]);
  for (const g of gaps) if (Math.abs(g - interval) > half + step) out.push(`interval ${g}, plan ${interval}`);
  const mean = (t[t.length - 1] - t[0]) / gaps.length;
  if (Math.abs(mean - interval) > half + step / gaps.length)
    out.push(`mean interval ${mean}, plan ${interval} (+-${half} + ${step}/${gaps.length})`);
  // Pin: the level the handler wrote after stop i shows as a P1 change before stop i+1.
  const bit = 7 - Number(p.pin.port.slice(3)); // "---- -H--": bits 7..0 with a space after bit 4
  const level: (0 | 1 | null)[] = seen.slice(1).map((s) => {
    const last = s.p1Changes[s.p1Changes.length - 1];
    if (!last) return null;
    const c = last.replace(" ", "")[bit];
    return c === "H" ? 1 : c === "l" || c === "L" ? 0 : null; // the gpio device prints "H" high, "l" low
  });
  let cur: 0 | 1 = 0;
  const levels = level.map((l) => (l === null ? cur : (cur = l)));
  const rises = levels.flatMap((l, i) => (l === 1 && (i === 0 ? 1 : levels[i - 1]) === 0 ? [i] : []));
  if (rises.length < 2) return [...out, `P1 rose ${rises.length} times in ${stops} interrupts`];
  const highTicks = levels.slice(rises[0], rises[1]).filter((l) => l === 1).length;
  const tick = 1 / p.clockHz;
  const periodS = (t[rises[1]] - t[rises[0]]) * tick;
  const highS = highTicks * interval * tick;
  // Against the REQUEST (what the old stage did), within half a timer count plus the emulator step
  const tol = (half + step) * tick;
  if (Math.abs(periodS - img.request.periodS) > tol)
    out.push(`period ${periodS} s, requested ${img.request.periodS} s`);
  if (Math.abs(highS - img.request.highS) > tol)
    out.push(`high ${highS} s, requested ${img.request.highS} s`);
  return [...out, ...timerRegisterFindings(img, o)];
}

/** PWM plan: the counter's period from TAR samples, the high time from TACCR1 (no output unit). */
function pwmFindings(img: Image, o: SimOptions = {}): string[] {
  const p = img.plan;
  const pre = countEvents(img.build.elf, 3 * p.divider * p.periodCounts + 5_000, 9, o);
  const out = clockFindings(p, pre.io);
  if (pre.resets > 0) out.push(`CPU reset ${pre.resets} times (watchdog not held?)`);
  if (((lastWrite(pre.io, P1DIR) ?? 0) & 0x04) === 0) out.push("P1.2 not an output");
  if (((lastWrite(pre.io, P1SEL) ?? 0) & 0x04) === 0) out.push("P1SEL.2 not set (TA0.1)");
  if (((lastWrite(pre.io, P1SEL2) ?? 0xff) & 0x04) !== 0) out.push("P1SEL2.2 not cleared (TA0.1)");
  // Samples a whole number of counts apart, not a divisor of the period, so wraps fall between them.
  const d = Math.floor(p.periodCounts * 0.37) + 1;
  const { samples } = sampleTimer(img.build.elf, 2000, d * p.divider, 10, o);
  const ns = periodsFromSamples(samples, p.divider);
  if (ns.length === 0) return [...out, "the timer never counted"];
  for (const n of ns)
    if (n !== p.periodCounts) out.push(`counter period ${n} counts, plan ${p.periodCounts}`);
  const last = samples[samples.length - 1];
  const tick = 1 / p.clockHz;
  const tol = (p.divider / 2) * tick;
  const periodS = ns[0] * p.divider * tick;
  const highS = last.ccr[1] * p.divider * tick; // OUTMOD_7: high for TACCR1 counts (SLAU144)
  if ((last.cctl[1] & 0xe0) !== 0xe0) out.push("TACCTL1 is not OUTMOD_7");
  if (Math.abs(periodS - img.request.periodS) > tol)
    out.push(`period ${periodS} s, requested ${img.request.periodS} s`);
  if (Math.abs(highS - img.request.highS) > tol)
    out.push(`high ${highS} s, requested ${img.request.highS} s`);
  return [...out, ...timerRegisterFindings(img, o)];
}

describe("MSP430G2553 images in mspdebug's simulator", () => {
  it.each([
    ["1 MHz calibrated DCO, ID 1", PWM_1M],
    ["16 MHz calibrated DCO, ID 8", PWM_16M],
  ])("PWM, %s: counter period, TACCR1 and every register as planned", (_n, request) => {
    expect(pwmFindings(image(request))).toEqual([]);
  });

  it.each([
    ["1 MHz calibrated DCO, ID 8, software divider", ISR_1M],
    ["LFXT1 32.768 kHz crystal (ACLK)", ISR_XT],
  ])("interrupt plan, %s: interrupt intervals and pin levels as planned", (_n, request) => {
    expect(isrFindings(image(request))).toEqual([]);
  });
});

describe("the simulator harness catches planted faults", () => {
  const ccr0 = (n: number) => ({ file: "src/main.c", from: `TA0CCR0 = ${n};`, to: `TA0CCR0 = ${n + 1};` });
  const noStart = { file: "src/main.c", from: / \| MC_1;/, to: ";" };
  const wdtRuns = { file: "src/startup.S", from: "mov.w #(WDTPW | WDTHOLD), &WDTCTL", to: "nop" };

  it("interrupt plan: TACCR0 one too high", () => {
    const f = isrFindings(image(ISR_1M, ccr0(62499)));
    // 8 cycles (one count at ID 8) longer per interval: beyond half a count plus the step spread over 9 intervals
    expect(f.some((x) => x.startsWith("mean interval 500008,"))).toBe(true);
    expect(f).toContain("TACCR0: plan.json 62499, running 62500");
  });
  it("interrupt plan: timer never started (MC bits left 0)", () => {
    expect(isrFindings(image(ISR_1M, noStart))).toContain("only 0 timer interrupts in 3 planned intervals");
  });
  it("interrupt plan: watchdog left running", () => {
    expect(isrFindings(image(ISR_1M, wdtRuns)).some((x) => x.startsWith("CPU reset"))).toBe(true);
  });
  it("interrupt plan: DCO calibration erased, the image refuses to run", () => {
    expect(isrFindings(image(ISR_1M), { calibration: false })).toContain(
      "only 0 timer interrupts in 3 planned intervals",
    );
  });
  it("PWM: TACCR0 one too high", () => {
    expect(pwmFindings(image(PWM_1M, ccr0(19999)))).toContain("counter period 20001 counts, plan 20000");
  });
  it("PWM: timer never started (MC bits left 0)", () => {
    expect(pwmFindings(image(PWM_1M, noStart))).toContain("the timer never counted");
  });
  it("PWM: watchdog left running", () => {
    expect(pwmFindings(image(PWM_1M, wdtRuns)).some((x) => x.startsWith("CPU reset"))).toBe(true);
  });
  it("PWM: DCO range changed without DCOCTL = 0 first", () => {
    const plant = { file: "src/main.c", from: /\n  DCOCTL = 0;[^\n]*/, to: "" };
    expect(pwmFindings(image(PWM_1M, plant)).some((x) => x.startsWith("DCO set-up writes"))).toBe(true);
  });
});
