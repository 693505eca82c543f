// Triggered and zero-cross firmware on the PIC12F1840 (engine.md section 6):
// the bundle's image (src/main.asm, built by the folder's own Makefile with
// gpasm) runs in gpsim (Debian gpsim 0.31, processor p12f1840) with the input
// pin RA1 driven by a gpsim stimulus (tests/tools/gpsim.ts pinStimulus), and
// every write to LATA (the output RA2) is logged with its instruction cycle.
// Expected values, PIC12(L)F1840 datasheet (DS40001441):
// - interrupt-on-change chapter: IOCAP selects rising, IOCAN falling edges,
//   both set = both edges (so every zero crossing of a square-wave detector);
// - Timer2 chapter: TMR2 counts at Fosc/4/prescale, matches PR2 and resets to 0
//   on the next increment, so a phase of N counts lasts N * prescale
//   instruction cycles (gpsim counts instruction cycles);
// - the stated latency (plan.latencyCycles, clocks; 4 clocks per instruction
//   cycle) from the datasheet's interrupt latency and the handler's cycles.
// Tolerance (issue 16): delay from the edge to the pulse's leading edge within
// one count below the counted delay and one count plus the stated latency
// above; pulse width within one count. Mains: 50 Hz and 60 Hz zero crossings
// (half cycles of 10 000 and 8 333 instruction cycles at 4 MHz).
// Planted faults kept as cases: wrong edge (IOCAP/IOCAN swapped), delay two
// counts long (PR2 + 2).
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { planTarget, type TimerPlan } from "@/lib/engine";
import { syntaxCheckFolder } from "@/tests/tools/c-check";
import { buildPic, latchWrites, pinStimulus, type LatchWrite } from "@/tests/tools/gpsim";

type Target = BundleTargetRequest & Record<string, unknown>;
type Change = { cycle: number; level: 0 | 1 };
const OUT_MASK = 1 << 2; // RA2, the output the PIC firmware uses (CCP1 pin)

function build(target: Target, edit?: (asm: string) => string) {
  const files = buildBundleSources({
    retrofit: { name: "Trigger proof" },
    revision: 1,
    stage: { kind: "timer555-monostable", r: 10e3, c: 1e-6 },
    targets: [target],
  });
  const plan = planTarget(target as never) as TimerPlan;
  return { plan, files, dir: buildPic(files, "pic12f1840", edit) };
}

interface Pulse {
  on: number;
  off: number;
}

function pulses(writes: LatchWrite[], activeLow = false): Pulse[] {
  const list: Pulse[] = [];
  let on: number | null = null;
  for (const w of writes) {
    const high = ((w.value & OUT_MASK) !== 0) !== activeLow;
    if (high && on === null) on = w.cycle;
    if (!high && on !== null) {
      list.push({ on, off: w.cycle });
      on = null;
    }
  }
  return list;
}

/** Problems of the pulses against the edges that should start them (instruction cycles). */
function judge(plan: TimerPlan, starts: number[], got: Pulse[]): string[] {
  const p: string[] = [];
  const count = plan.divider / 4;
  const delay = plan.delayCounts! * count;
  const width = plan.highCounts * count;
  const latency = plan.latencyCycles! / 4;
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

function run(dir: string, changes: Change[], until: number): Pulse[] {
  // Start-up (crystal, XT) takes a few hundred cycles: the first edge comes later.
  return pulses(latchWrites(dir, until, pinStimulus("RA1", changes)).filter((w) => w.cycle > 100));
}

/** Square-wave zero-cross detector output: a change every half cycle. */
function mains(hz: number, halfCycles: number, first = 5000): Change[] {
  const half = 1e6 / (2 * hz); // instruction cycles at 4 MHz
  return Array.from({ length: halfCycles }, (_, k) => ({
    cycle: Math.round(first + k * half),
    level: (k % 2 === 0 ? 1 : 0) as 0 | 1,
  }));
}

const zeroCross: Target = {
  device: "pic12f1840",
  clockHz: 4e6,
  periodS: 0.01,
  highS: 2e-4,
  start: "zero-cross",
  edge: "both",
  delayS: 0.005,
};

describe("PIC12F1840 zero-cross firmware in gpsim", () => {
  const base = build(zeroCross);

  it.each([50, 60])("fires once per half cycle at %d Hz, delay and width within one count", (hz) => {
    const edges = mains(hz, 6);
    const got = run(base.dir, edges, edges[5].cycle + 9000);
    expect(
      judge(
        base.plan,
        edges.map((e) => e.cycle),
        got,
      ),
    ).toEqual([]);
  });

  it("the latency stated in the plan is the datasheet response plus the counted handler", () => {
    // 5 instruction cycles asynchronous response + up to 7 to the count's start (restart rule; 6 here),
    // then up to 4 + 10 to the LATA write (x 4 clocks)
    expect(base.plan.latencyCycles).toBe((5 + 7 + 4 + 10) * 4);
    const asm = String(base.files.find((f) => f.path === "pic12f1840/src/main.asm")!.content);
    expect(asm).toMatch(/bsf\s+T2CON, TMR2ON\s+; 1: cycle 6/);
    expect(asm).toMatch(/movwf\s+LATA\s+; 1: cycle 10, pulse on/);
    expect(asm).toMatch(/movwf\s+LATA\s+; 1: cycle 10, pulse off/);
  });

  it("the C twin for the vendor's compiler passes the syntax check", () => {
    const r = syntaxCheckFolder(base.files, "pic12f1840");
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
  });

  it("planted fault: the wrong edge (IOCAP and IOCAN swapped) is caught", () => {
    const t: Target = { ...zeroCross, start: "trigger", edge: "rising", retrigger: "ignore" };
    const bad = build(t, (asm) =>
      asm
        .replace(/movlw\s+0x02\n(\s+movwf\s+IOCAP)/, "movlw   0x00\n$1")
        .replace(/movlw\s+0x00\n(\s+movwf\s+IOCAN)/, "movlw   0x02\n$1"),
    );
    const edges: Change[] = [
      { cycle: 5000, level: 1 },
      { cycle: 7000, level: 0 },
    ];
    expect(judge(bad.plan, [5000], run(bad.dir, edges, 20000)).length).toBeGreaterThan(0);
  });

  it("planted fault: a delay two counts long is caught", () => {
    const bad = build(zeroCross, (asm) =>
      asm.replace(
        /movlw\s+(\d+)\n(\s+movwf\s+PR2\s+; the delay's match)/,
        (_, n, rest) => `movlw   ${Number(n) + 2}\n${rest}`,
      ),
    );
    const edges = mains(50, 4);
    const got = run(bad.dir, edges, edges[3].cycle + 9000);
    // the first delay comes from the start-up's PR2 (unchanged); the later ones are two counts long
    expect(
      judge(
        bad.plan,
        edges.map((e) => e.cycle),
        got,
      ).length,
    ).toBeGreaterThan(0);
  });
});

describe("PIC12F1840 triggered one-shot in gpsim", () => {
  const trig: Target = {
    device: "pic12f1840",
    clockHz: 4e6,
    periodS: 0.01,
    highS: 5e-4,
    start: "trigger",
    edge: "rising",
    delayS: 0.002,
  };

  it("rising edge only: a falling edge starts nothing", () => {
    const b = build({ ...trig, retrigger: "ignore" });
    const edges: Change[] = [
      { cycle: 5000, level: 1 },
      { cycle: 9000, level: 0 },
      { cycle: 13000, level: 1 },
    ];
    expect(judge(b.plan, [5000, 13000], run(b.dir, edges, 20000))).toEqual([]);
  });

  it("falling edge (IOCAN): the pulse follows the falling edge", () => {
    const b = build({ ...trig, edge: "falling", retrigger: "ignore" });
    const edges: Change[] = [
      { cycle: 5000, level: 1 },
      { cycle: 6000, level: 0 },
    ];
    expect(judge(b.plan, [6000], run(b.dir, edges, 12000))).toEqual([]);
  });

  it("ignore rule: a second trigger during the delay changes nothing", () => {
    const b = build({ ...trig, retrigger: "ignore" });
    const edges: Change[] = [
      { cycle: 5000, level: 1 },
      { cycle: 5500, level: 0 },
      { cycle: 6000, level: 1 },
    ];
    expect(judge(b.plan, [5000], run(b.dir, edges, 12000))).toEqual([]);
  });

  it("restart rule: a second trigger during the delay starts it again", () => {
    const b = build({ ...trig, retrigger: "restart" });
    const edges: Change[] = [
      { cycle: 5000, level: 1 },
      { cycle: 5500, level: 0 },
      { cycle: 6000, level: 1 },
    ];
    expect(judge(b.plan, [6000], run(b.dir, edges, 12000))).toEqual([]);
  });
});
