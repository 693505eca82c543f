// The kept selector switch on the ATmega328P: the bundle's src/main.c (built
// with avr-gcc) runs in libsimavr through tests/tools/simavr/switch-trace.c,
// which holds the switch's contacts on PORTD low or high by cycle, and OC1A
// (PB1) is traced. Expected values: the old stage's own period per switched
// capacitor, NE555 astable (TI NE555 datasheet SLFS022, astable operation)
// T = ln 2 * (RA + 2 RB) * C, high = ln 2 * (RA + RB) * C. Tolerance: one
// Timer1 count (62.5 ns at 16 MHz, divider 1): the table rounds to half a
// count and simavr's Timer1 runs exact to the cycle (verification.md).
// The pull-ups are not modelled by simavr's pin IRQs: the harness drives an
// open contact high itself, so the firmware's PORTD pull-up writes are checked
// in the source. simavr 1.6 takes a new ICR1/OCR1A only when the timer is
// reconfigured (seen here: the overflow handler ran and wrote them, the period
// did not change), so the test build stops and restarts Timer1's clock (TCCR1B)
// after each change (simRefresh; on the chip one cycle lost in that period). Pin edges
// are placed between instructions: periods seen alternate by one cycle, so the
// tolerance adds two cycles. Planted faults kept as cases: a position read on the wrong
// pin, a wrong table entry, no debounce.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleSpec } from "@/lib/bundle";
import { mustRun } from "@/tests/tools/require-tool";
import { buildAvrHex } from "@/tests/tools/simavr-adc";
import { simavrHarness } from "@/tests/tools/simavr";
import { measure, parseVcd, type Edge } from "@/tests/tools/vcd";

const F = 16e6;
const RA = 1e3;
const RB = 10e3;
const VALUES = [47e-9, 100e-9, 220e-9];
const spec: BundleSpec = {
  retrofit: {
    name: "Flasher with a rate switch",
    site: "Test bench",
    assetTag: "T-2",
    mainsPowered: false,
    drivesThyristor: false,
  },
  revision: 1,
  stage: { kind: "timer555-astable", supplyV: 5, ra: RA, rb: RB, c: 100e-9 },
  control: { kind: "selector", field: "c", values: VALUES },
  targets: [
    { device: "atmega328p", clockHz: F, periodS: 1.4e-3, highS: 0.7e-3, mode: "pwm", timer: "TIMER1" },
  ],
};
const files = buildBundleSources(spec);
const text = (p: string) => String(files.find((f) => f.path === p)!.content);
const shipped = text("atmega328p/src/main.c");
const simRefresh = (src: string) => {
  const next = src.replace(
    "  sel_applied = i;\n",
    "  sel_applied = i;\n  { uint8_t b = TCCR1B; TCCR1B = 0; TCCR1B = b; } /* test build only: simavr reconfigures Timer1 */\n",
  );
  if (next === src) throw new Error("sel_apply not found");
  return next;
};
const source = simRefresh(shipped);

const oldStage = (c: number) => ({ periodS: Math.LN2 * (RA + 2 * RB) * c, highS: Math.LN2 * (RA + RB) * c });
const PD = (...bits: number[]) => bits.reduce((m, b) => m | (1 << b), 0);
const ms = (t: number) => Math.round(t * 1e-3 * F);

// Position 2 from the start; position 3 at 30 ms; no contact at 60 ms and two contacts at 80 ms
// (both keep position 3); contact bounce on position 1 (2 ms steps) from 90 to 100 ms, then
// position 1 held.
const EVENTS: [number, number][] = [
  [0, PD(3)],
  [ms(30), PD(4)],
  [ms(60), 0],
  [ms(80), PD(2, 4)],
  ...Array.from({ length: 5 }, (_, i): [number, number][] => [
    [ms(90 + 2 * i), PD(2)],
    [ms(91 + 2 * i), 0],
  ]).flat(),
  [ms(100), PD(2)],
];
const WINDOWS: { from: number; to: number; position: number; why: string }[] = [
  { from: 22, to: 30, position: 2, why: "held from power-up" },
  { from: 53, to: 60, position: 3, why: "after the switch moved" },
  { from: 62, to: 90, position: 3, why: "between contacts (none or two low)" },
  { from: 92, to: 119, position: 3, why: "while the contact bounces" },
  { from: 124, to: 135, position: 1, why: "after the bounce settled" },
];

function run(src: string): Edge[] {
  const hex = buildAvrHex(src, "atmega328p", F);
  const bin = simavrHarness("switch-trace");
  const dir = path.dirname(hex);
  const args = ["atmega328p", String(F), hex, "B", "1", String(ms(136)), "sel.vcd", "D"];
  mustRun(bin, [...args, ...EVENTS.map(([c, m]) => `${c}:${m}`)], dir, 120_000);
  return parseVcd(readFileSync(path.join(dir, "sel.vcd"), "utf8"), "PB1");
}

/** What disagrees with the old stage's period in each window (empty = all agree within one count). */
function judge(src: string): string[] {
  const edges = run(src);
  const count = 1 / F + 2 / F;
  const out: string[] = [];
  for (const w of WINDOWS) {
    const inside = edges.filter((e) => e.t >= w.from * 1e-3 && e.t <= w.to * 1e-3);
    const { periods, highs } = measure(inside);
    const want = oldStage(VALUES[w.position - 1]);
    if (periods.length < 1) {
      out.push(`${w.from}..${w.to} ms: no whole period`);
      continue;
    }
    const bad = periods.find((p) => Math.abs(p - want.periodS) > count);
    if (bad !== undefined)
      out.push(
        `${w.from}..${w.to} ms (${w.why}): period ${bad} s, position ${w.position} wants ${want.periodS} s`,
      );
    const badHigh = highs.find((h) => Math.abs(h - want.highS) > count);
    if (badHigh !== undefined)
      out.push(
        `${w.from}..${w.to} ms (${w.why}): high ${badHigh} s, position ${w.position} wants ${want.highS} s`,
      );
  }
  return out;
}

function plant(from: string | RegExp, to: string): string {
  const next = source.replace(from, to);
  if (next === source) throw new Error(`planted fault: ${String(from)} not in main.c`);
  return next;
}

describe("ATmega328P kept selector switch in simavr: PD2..PD4, Timer1 mode 14 on PB1", () => {
  it("inputs with pull-ups, the pin map names each contact and the common, one checklist line per position", () => {
    // DS40002061 I/O-Ports: DDxn = 0, PORTxn = 1 is an input with the pull-up on
    expect(shipped).toMatch(/DDRD &= \(uint8_t\)~SEL_MASK;\s*PORTD \|= SEL_MASK;/);
    expect(shipped).toContain("#define SEL_MASK 0x1Cu");
    expect(shipped).not.toContain("TCCR1B = 0;");
    const pm = text("atmega328p/PINMAP.md");
    expect(pm).toMatch(
      /\| switch position 1 \(c = 47 nF\): contact to this pin, internal pull-up \| PD2 \| 4 /,
    );
    expect(pm).toMatch(/\| switch common contact to ground \| GND \| 8 /);
    const cl = text("atmega328p/CHECKLIST.md");
    expect(cl.match(/^\| P\d \| Turn the selector to position \d/gm)).toHaveLength(3);
    const plan = JSON.parse(text("plan.json")) as {
      targets: { control: { kind: string; positions: number } }[];
    };
    expect(plan.targets[0].control).toMatchObject({ kind: "selector", positions: 3 });
  });

  it("every position gives the old stage's period and high time; between contacts and while bouncing it keeps the last", () => {
    expect(judge(source)).toEqual([]);
  });

  it("planted fault: position 2 read on PD4 instead of PD3 is caught", () => {
    // position 2's pin then reads like position 3's: the held PD3 reads as no contact (the stored value's
    // position, 2, is kept), and PD4 reads as two contacts, so the move to position 3 is never taken
    expect(judge(plant(/  3u, \/\* position 2 \*\//, "  4u, /* position 2 */")).join("; ")).toMatch(
      /53\.\.60 ms \(after the switch moved\): period/,
    );
  });

  it("planted fault: position 2's TOP five counts long is caught", () => {
    const top = /sel_top\[SEL_POSITIONS\] PROGMEM = \{\n\s+\d+u,\n\s+(\d+)u,/.exec(source)![1];
    const wrong = source.replace(
      /(sel_top\[SEL_POSITIONS\] PROGMEM = \{\n\s+\d+u,\n\s+)(\d+)u,/,
      `$1${Number(top) + 5}u,`,
    );
    expect(judge(wrong).join("; ")).toMatch(/22\.\.30 ms .*position 2/);
  });

  it("planted fault: no debounce (one sample) follows the bouncing contact and is caught", () => {
    expect(judge(plant("#define SEL_DEBOUNCE_MS 20u", "#define SEL_DEBOUNCE_MS 1u")).join("; ")).toMatch(
      /92\.\.119 ms \(while the contact bounces\)/,
    );
  });
});
