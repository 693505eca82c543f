// Triggered and zero-cross firmware on the MSP430G2553 (engine.md section 6):
// the bundle's image (built by the folder's own Makefile, Debian clang + lld
// against msp430mcu) runs in mspdebug's simulator (Debian mspdebug 0.22,
// tests/tools/mspdebug-sim.ts). Its gpio device can drive an input pin and
// raise the port interrupt (`simio config p1 irq 2`, `simio config p1 set`),
// so the input P1.3 is driven here; the tracer stamps every accepted
// interrupt and every IO write with the MCLK count, so the edge-to-pulse delay
// and the width are read from the P1OUT writes (the simulator has no Timer_A
// output unit, but this firmware switches P1.2 from its handlers anyway).
// What the simulator does not check: the real pin's input synchroniser and
// the edge detector's own timing (SLAU144 Digital I/O: P1IFG is set on the
// selected transition); P1IES-write side effects are covered by clearing
// P1IFG after the flip, which the code does in that order.
// Expected values, MSP430x2xx Family User's Guide (SLAU144):
// - Digital I/O: P1IES = 0 rising, 1 falling edge; P1IE enables, P1IFG flags;
// - Timer_A up mode: TACCRx CCIFG when TAR counts to TACCRx, so the pulse goes
//   on TACCR1 = delayCounts counts and off TACCR0 = delayCounts + highCounts
//   counts after the start (counts of SMCLK/ID);
// - interrupt acceptance 6 cycles; the stated latency (plan.latencyCycles)
//   from that and the handlers' cycle counts. SLAS735 vector table: PORT1 slot
//   2, TIMER0_A1 slot 8, TIMER0_A0 slot 9.
// Tolerance (issue 16): delay within one count below and one count plus the
// stated latency above; width within one count. Mains: 50 Hz and 60 Hz zero
// crossings (half cycles of 10 000 and 8 333 cycles at 1 MHz), placed by
// stepping the idle loop (2 cycles a step, family guide: JMP), so each edge's
// own MCLK stamp is the reference and the spacing is checked to be the mains'.
// Planted faults kept as cases: wrong edge (P1IES), delay two counts long (TA0CCR1 + 2).
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { planTarget, type TimerPlan } from "@/lib/engine";
import { buildMsp430, type Plant } from "@/tests/tools/msp430-build";
import { runWithInputs, type InputChange, type IoWrite } from "@/tests/tools/mspdebug-sim";

type Target = BundleTargetRequest & Record<string, unknown>;
const P1OUT = 0x21;
const OUT_MASK = 1 << 2; // P1.2
const IN_PIN = 3; // P1.3
const PORT1_SLOT = 2;
const SETTLE_STEPS = 300; // start-up to the idle loop (DCO calibration, set-up): about 130 cycles

function build(target: Target, plant?: Plant) {
  const files = buildBundleSources({
    retrofit: { name: "Trigger proof" },
    revision: 1,
    stage: { kind: "timer555-monostable", r: 10e3, c: 1e-6 },
    targets: [target],
  });
  const plan = planTarget(target as never) as TimerPlan;
  const b = buildMsp430(files, "msp430g2553", plant);
  if (b.make.status !== 0) throw new Error(`make failed:\n${b.make.stderr}`);
  return { plan, files, elf: b.elf };
}

interface Pulse {
  on: number;
  off: number;
}

/** Pulses on P1.2 from the P1OUT byte writes; an active-low output's pulse is the pin low. */
function pulses(io: IoWrite[], activeLow = false): Pulse[] {
  const list: Pulse[] = [];
  let on: number | null = null;
  for (const w of io) {
    if (w.addr !== P1OUT || w.width !== "b") continue;
    const active = ((w.value & OUT_MASK) !== 0) !== activeLow;
    if (active && on === null) on = w.at;
    if (!active && on !== null) {
      list.push({ on, off: w.at });
      on = null;
    }
  }
  return list;
}

function judge(plan: TimerPlan, starts: number[], got: Pulse[]): string[] {
  const p: string[] = [];
  const count = plan.divider;
  const delay = plan.delayCounts! * count;
  const width = plan.highCounts * count;
  const latency = plan.latencyCycles!;
  if (got.length !== starts.length) p.push(`${got.length} pulses for ${starts.length} starting edges`);
  starts.forEach((edge, i) => {
    const g = got[i];
    if (!g) return;
    const d = g.on - edge;
    if (d < delay - count || d > delay + count + latency)
      p.push(`pulse ${i}: delay ${d} cycles, counted ${delay} (+${count + latency} / -${count})`);
    if (Math.abs(g.off - g.on - width) > count) p.push(`pulse ${i}: width ${g.off - g.on}, want ${width}`);
  });
  return p;
}

/**
 * The interrupt path, tighter than the pin: the TACCR1 interrupt is accepted
 * delayCounts counts after the TA0CTL write that starts the timer, the TACCR0
 * one highCounts counts after that (Timer_A up mode), each within one count
 * plus the instruction in progress (the idle loop's JMP, 2 cycles; family
 * guide: an interrupt is accepted after the current instruction). With 1 us
 * counts two counts lie inside the stated latency, so this is the check that
 * sees a delay two counts long.
 */
function timerPathProblems(plan: TimerPlan, r: ReturnType<typeof run>): string[] {
  const p: string[] = [];
  const count = plan.divider;
  const starts = r.io.filter((w) => w.addr === 0x0160 && w.width === "w" && (w.value & 0x30) === 0x10);
  const on = r.irqs.filter((q) => q.slot === 8);
  const off = r.irqs.filter((q) => q.slot === 9);
  if (on.length === 0 || on.length !== off.length)
    p.push(`${on.length} TACCR1 / ${off.length} TACCR0 interrupts`);
  on.forEach((a, i) => {
    const s = [...starts].reverse().find((w) => w.at < a.at);
    if (!s) return p.push(`TACCR1 interrupt ${i} without a timer start`);
    const d = a.at - s.at - plan.delayCounts! * count;
    if (d < -count || d > count + 2) p.push(`TACCR1 interrupt ${i}: ${d} cycles off the counted delay`);
    const w = (off[i]?.at ?? NaN) - a.at - plan.highCounts * count;
    if (!(Math.abs(w) <= count)) p.push(`TACCR0 interrupt ${i}: ${w} cycles off the counted pulse`);
  });
  return p;
}

/** Changes at (roughly) the given cycles after the idle loop is reached: the idle loop steps 2 cycles. */
function schedule(list: { cycle: number; level: 0 | 1 }[]): InputChange[] {
  let prev = 0;
  return list.map((c, i) => {
    const steps = i === 0 ? SETTLE_STEPS : Math.round((c.cycle - prev) / 2);
    prev = c.cycle;
    return { steps, pin: IN_PIN, level: c.level };
  });
}

function run(elf: string, list: { cycle: number; level: 0 | 1 }[], tail = 6000, activeLow = false) {
  const r = runWithInputs(elf, schedule(list), tail, { p1Irq: PORT1_SLOT });
  return { ...r, pulses: pulses(r.io, activeLow) };
}

function mains(hz: number, halfCycles: number): { cycle: number; level: 0 | 1 }[] {
  const half = 1e6 / (2 * hz);
  return Array.from({ length: halfCycles }, (_, k) => ({
    cycle: Math.round(k * half),
    level: (k % 2 === 0 ? 1 : 0) as 0 | 1,
  }));
}

const zeroCross: Target = {
  device: "msp430g2553",
  clockSource: "dco-cal",
  clockHz: 1e6,
  periodS: 0.01,
  highS: 2e-4,
  start: "zero-cross",
  edge: "both",
  delayS: 0.005,
};

describe("MSP430G2553 zero-cross firmware in mspdebug's simulator", () => {
  const base = build(zeroCross);

  it.each([50, 60])("fires once per half cycle at %d Hz, delay and width within one count", (hz) => {
    const r = run(base.elf, mains(hz, 6));
    // the stimulus is the mains': edges a half cycle apart (within 1 %)
    const half = 1e6 / (2 * hz);
    for (let i = 1; i < r.changeAt.length; i++)
      expect(Math.abs(r.changeAt[i] - r.changeAt[i - 1] - half)).toBeLessThan(half * 0.01);
    // the interrupt path: one PORT1 interrupt per edge (P1IES flipped each time)
    expect(r.irqs.filter((q) => q.slot === PORT1_SLOT).length).toBe(6);
    expect(judge(base.plan, r.changeAt, r.pulses)).toEqual([]);
    expect(timerPathProblems(base.plan, r)).toEqual([]);
  });

  it("the latency stated in the plan is the family guide's acceptance plus the counted handlers", () => {
    // 6 + 6 to accept the port interrupt, 5 to the TA0CTL store; 6 + 6 + 4 to the P1OUT write
    expect(base.plan.latencyCycles).toBe(6 + 6 + 5 + 6 + 6 + 4);
    const main = String(base.files.find((f) => f.path === "msp430g2553/src/main.c")!.content);
    expect(main).toMatch(/"  bis\.w #0x0010, &0x0160\\n"/);
    expect(main).toMatch(/"  bis\.b #0x04, &0x0021\\n"/);
  });

  it("planted fault: a delay two counts long (TACCR1 and TACCR0 + 2, same pulse) is caught", () => {
    const d = base.plan.delayCounts!;
    const bad = build(zeroCross, {
      file: "src/main.c",
      from: new RegExp(`TA0CCR1 = ${d}u;([\\s\\S]*?)TA0CCR0 = ${d + base.plan.highCounts}u;`),
      to: `TA0CCR1 = ${d + 2}u;$1TA0CCR0 = ${d + 2 + base.plan.highCounts}u;`,
    });
    const r = run(bad.elf, mains(50, 4));
    expect(timerPathProblems(bad.plan, r).length).toBeGreaterThan(0);
  });
});

describe("MSP430G2553 triggered one-shot in mspdebug's simulator", () => {
  const trig: Target = {
    device: "msp430g2553",
    clockSource: "dco-cal",
    clockHz: 1e6,
    periodS: 0.01,
    highS: 5e-4,
    start: "trigger",
    edge: "rising",
    delayS: 0.002,
  };
  const ignore = build({ ...trig, retrigger: "ignore" });

  it("rising edge only: a falling edge starts nothing", () => {
    const r = run(ignore.elf, [
      { cycle: 0, level: 1 },
      { cycle: 4000, level: 0 },
      { cycle: 8000, level: 1 },
    ]);
    expect(judge(ignore.plan, [r.changeAt[0], r.changeAt[2]], r.pulses)).toEqual([]);
    expect(timerPathProblems(ignore.plan, r)).toEqual([]);
  });

  it("planted fault: the wrong edge (P1IES set for falling) is caught", () => {
    const bad = build(
      { ...trig, retrigger: "ignore" },
      {
        file: "src/main.c",
        from: "P1IES &= (uint8_t)~BIT3;",
        to: "P1IES |= BIT3;",
      },
    );
    const r = run(bad.elf, [
      { cycle: 0, level: 1 },
      { cycle: 4000, level: 0 },
      { cycle: 8000, level: 1 },
    ]);
    expect(judge(bad.plan, [r.changeAt[0], r.changeAt[2]], r.pulses).length).toBeGreaterThan(0);
  });

  it("falling edge: the pulse follows the falling edge", () => {
    const b = build({ ...trig, edge: "falling", retrigger: "ignore" });
    const r = run(b.elf, [
      { cycle: 0, level: 1 },
      { cycle: 1000, level: 0 },
    ]);
    expect(judge(b.plan, [r.changeAt[1]], r.pulses)).toEqual([]);
  });

  it("ignore rule: a second trigger during the delay changes nothing", () => {
    const r = run(ignore.elf, [
      { cycle: 0, level: 1 },
      { cycle: 500, level: 0 },
      { cycle: 1000, level: 1 },
    ]);
    expect(judge(ignore.plan, [r.changeAt[0]], r.pulses)).toEqual([]);
  });

  // Active-low (the engine's "the pin is low for the pulse"): SLAU144 Digital I/O, a pin with its
  // P1DIR bit set is driven at its P1OUT bit, so P1OUT must already hold the off level (high) when
  // the P1DIR write turns the driver on, and the pin is low only between the two timer interrupts.
  it("active-low: high from the moment the driver is on, low for the delayed pulse only", () => {
    const b = build({ ...trig, retrigger: "ignore", activeLow: true });
    const r = run(b.elf, [{ cycle: 0, level: 1 }], 6000, true);
    const P1DIR = 0x22;
    const driverOn = r.io.find((w) => w.addr === P1DIR && w.width === "b" && (w.value & OUT_MASK) !== 0);
    expect(driverOn, "a P1DIR write that makes P1.2 an output").toBeDefined();
    const outBefore = r.io.filter((w) => w.addr === P1OUT && w.width === "b" && w.at <= driverOn!.at);
    expect(outBefore.length).toBeGreaterThan(0);
    expect(outBefore.at(-1)!.value & OUT_MASK).toBe(OUT_MASK);
    // no low level between the driver switching on and the first pulse
    const firstOn = r.pulses[0]?.on ?? Infinity;
    const lowEarly = r.io.filter(
      (w) =>
        w.addr === P1OUT && w.width === "b" && w.at > driverOn!.at && w.at < firstOn && !(w.value & OUT_MASK),
    );
    expect(lowEarly).toEqual([]);
    expect(judge(b.plan, [r.changeAt[0]], r.pulses)).toEqual([]);
  });

  it("restart rule: a second trigger during the delay starts it again", () => {
    const b = build({ ...trig, retrigger: "restart" });
    const r = run(b.elf, [
      { cycle: 0, level: 1 },
      { cycle: 500, level: 0 },
      { cycle: 1000, level: 1 },
    ]);
    expect(judge(b.plan, [r.changeAt[2]], r.pulses)).toEqual([]);
  });
});
