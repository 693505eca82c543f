// The kept selector switch on the AVRs: the bundle's src/main.c (built with
// avr-gcc) runs in libsimavr through lib/firmware/emulate/harness/simavr/switch-trace.c, which
// holds the switch's contacts low or high by cycle, and the timer output is
// traced. Expected values: the old stage's own period per switched capacitor,
// NE555 astable (TI NE555 datasheet SLFS022, astable operation)
// T = ln 2 * (RA + 2 RB) * C, high = ln 2 * (RA + RB) * C. Tolerance: one timer
// count (the table rounds to half a count) plus two cycles: pin edges are
// placed between instructions (periods seen here alternate by one cycle).
// The pull-ups are not modelled by simavr's pin IRQs: the harness drives an
// open contact high itself, so the firmware's pull-up writes are checked in
// the source. simavr 1.6 takes a new ICR1 only when Timer1 is reconfigured
// (seen here: the ATmega328P's overflow handler ran and wrote ICR1/OCR1A, the
// period did not change), so the ATmega328P test build stops and restarts
// TCCR1B after each change (simRefresh; on the chip one cycle would be lost in
// that period); the shipped source does not. Planted faults kept as cases: a
// position read on the wrong pin, a wrong table entry, no debounce.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleSpec, type BundleTargetRequest } from "@/lib/bundle";
import { mustRun } from "@/tests/tools/require-tool";
import { buildAvrHex } from "@/tests/tools/simavr-adc";
import { simavrHarness } from "@/tests/tools/simavr";
import { measure, parseVcd, type Edge } from "@/lib/firmware/emulate/harness/vcd";

const RA = 1e3;
const RB = 10e3;
const VALUES = [47e-9, 100e-9, 220e-9];

interface Device {
  request: BundleTargetRequest;
  port: "B" | "D";
  /** input bits of positions 1..3 */
  bits: [number, number, number];
  /** package pin of position 1's input and of ground (pin tables, from memory) */
  firstPin: number;
  groundPin: number;
  refresh: (src: string) => string;
}

const DEVICES: Record<string, Device> = {
  atmega328p: {
    request: {
      device: "atmega328p",
      clockHz: 16e6,
      periodS: 1.4e-3,
      highS: 0.7e-3,
      mode: "pwm",
      timer: "TIMER1",
    },
    port: "D",
    bits: [2, 3, 4],
    firstPin: 4,
    groundPin: 8,
    refresh: (src) => {
      const next = src.replace(
        "  sel_applied = i;\n",
        "  sel_applied = i;\n  { uint8_t b = TCCR1B; TCCR1B = 0; TCCR1B = b; } /* test build only: simavr reconfigures Timer1 */\n",
      );
      if (next === src) throw new Error("sel_apply not found");
      return next;
    },
  },
  attiny85: {
    request: {
      device: "attiny85",
      clockHz: 8e6,
      periodS: 1.4e-3,
      highS: 0.7e-3,
      mode: "pwm",
      timer: "TIMER0",
    },
    port: "B",
    bits: [0, 2, 3],
    firstPin: 5,
    groundPin: 4,
    // OCR0A/OCR0B are double buffered and simavr's Timer0 follows them
    refresh: (src) => src,
  },
};

const oldStage = (c: number) => ({ periodS: Math.LN2 * (RA + 2 * RB) * c, highS: Math.LN2 * (RA + RB) * c });

// Position 2 from the start; position 3 at 30 ms; no contact at 60 ms and two contacts at 80 ms
// (both keep position 3); contact bounce on position 1 (1 ms steps) from 90 to 100 ms, then
// position 1 held.
function events(d: Device, f: number): [number, number][] {
  const ms = (t: number) => Math.round(t * 1e-3 * f);
  const pos = (...p: number[]) => p.reduce((m, k) => m | (1 << d.bits[k - 1]), 0);
  return [
    [0, pos(2)],
    [ms(30), pos(3)],
    [ms(60), 0],
    [ms(80), pos(1, 3)],
    ...Array.from({ length: 5 }, (_, i): [number, number][] => [
      [ms(90 + 2 * i), pos(1)],
      [ms(91 + 2 * i), 0],
    ]).flat(),
    [ms(100), pos(1)],
  ];
}
const WINDOWS: { from: number; to: number; position: number; why: string }[] = [
  { from: 22, to: 30, position: 2, why: "held from power-up" },
  { from: 53, to: 60, position: 3, why: "after the switch moved" },
  { from: 62, to: 90, position: 3, why: "between contacts (none or two low)" },
  { from: 92, to: 119, position: 3, why: "while the contact bounces" },
  { from: 124, to: 135, position: 1, why: "after the bounce settled" },
];

describe.each(Object.entries(DEVICES))("%s kept selector switch in simavr", (device, d) => {
  const f = d.request.clockHz;
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
    targets: [d.request],
  };
  const files = buildBundleSources(spec);
  const text = (p: string) => String(files.find((x) => x.path === p)!.content);
  const shipped = text(`${device}/src/main.c`);
  const planJson = JSON.parse(text("plan.json")) as {
    targets: { control: { kind: string; positions: number; divider: number; clockHz: number } }[];
  };
  // one count of the firmware's timer: the selector table's divider
  const countS = planJson.targets[0].control.divider / planJson.targets[0].control.clockHz;
  const source = d.refresh(shipped);
  const mask = d.bits.reduce((m, b) => m | (1 << b), 0);

  function run(src: string): Edge[] {
    const hex = buildAvrHex(src, device, f);
    const bin = simavrHarness("switch-trace");
    const dir = path.dirname(hex);
    const cycles = Math.round(0.136 * f);
    const args = [device, String(f), hex, "B", "1", String(cycles), "sel.vcd", d.port, String(mask)];
    mustRun(bin, [...args, ...events(d, f).map(([c, m]) => `${c}:${m}`)], dir, 120_000);
    return parseVcd(readFileSync(path.join(dir, "sel.vcd"), "utf8"), "PB1");
  }

  /** What disagrees with the old stage in each window (empty = all agree within the tolerance). */
  function judge(src: string): string[] {
    const edges = run(src);
    const tol = countS + 2 / f;
    const out: string[] = [];
    for (const w of WINDOWS) {
      const inside = edges.filter((e) => e.t >= w.from * 1e-3 && e.t <= w.to * 1e-3);
      const { periods, highs } = measure(inside);
      const want = oldStage(VALUES[w.position - 1]);
      if (periods.length < 1) {
        out.push(`${w.from}..${w.to} ms: no whole period`);
        continue;
      }
      const bad = periods.find((p) => Math.abs(p - want.periodS) > tol);
      if (bad !== undefined)
        out.push(
          `${w.from}..${w.to} ms (${w.why}): period ${bad} s, position ${w.position} wants ${want.periodS} s`,
        );
      const badHigh = highs.find((h) => Math.abs(h - want.highS) > tol);
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

  it("inputs with pull-ups, the pin map names each contact and the common, one checklist line per position", () => {
    // datasheets' I/O ports chapter: DDxn = 0, PORTxn = 1 is an input with the pull-up on
    expect(shipped).toMatch(
      new RegExp(`DDR${d.port} &= \\(uint8_t\\)~SEL_MASK;\\s*PORT${d.port} \\|= SEL_MASK;`),
    );
    expect(shipped).toContain(`#define SEL_MASK 0x${mask.toString(16).toUpperCase().padStart(2, "0")}u`);
    expect(shipped).not.toContain("TCCR1B = 0;");
    const pm = text(`${device}/PINMAP.md`);
    expect(pm).toContain(
      `| switch position 1 (c = 47 nF): contact to this pin, internal pull-up | P${d.port}${d.bits[0]} | ${d.firstPin} `,
    );
    expect(pm).toContain(`| switch common contact to ground | GND | ${d.groundPin} `);
    const cl = text(`${device}/CHECKLIST.md`);
    expect(cl.match(/^\| P\d \| Turn the selector to position \d/gm)).toHaveLength(3);
    expect(planJson.targets[0].control).toMatchObject({ kind: "selector", positions: 3 });
  });

  it("every position gives the old stage's period and high time; between contacts and while bouncing it keeps the last", () => {
    expect(judge(source)).toEqual([]);
  });

  it("planted fault: position 2 read on position 3's pin is caught", () => {
    // the held position-2 contact then reads as no contact (the stored value's position, 2, is kept),
    // and position 3's contact as two contacts, so the move to position 3 is never taken
    const wrong = plant(
      new RegExp(`  ${d.bits[1]}u, /\\* position 2 \\*/`),
      `  ${d.bits[2]}u, /* position 2 */`,
    );
    expect(judge(wrong).join("; ")).toMatch(/53\.\.60 ms \(after the switch moved\): period/);
  });

  it("planted fault: position 2's TOP five counts long is caught", () => {
    const re = /(sel_top\[SEL_POSITIONS\] PROGMEM = \{\n\s+\d+u,\n\s+)(\d+)u,/;
    const top = re.exec(source)![2];
    expect(judge(source.replace(re, `$1${Number(top) + 5}u,`)).join("; ")).toMatch(
      /22\.\.30 ms .*position 2/,
    );
  });

  it("planted fault: no debounce (one sample) follows the bouncing contact and is caught", () => {
    expect(judge(plant("#define SEL_DEBOUNCE_MS 20u", "#define SEL_DEBOUNCE_MS 1u")).join("; ")).toMatch(
      /92\.\.119 ms \(while the contact bounces\)/,
    );
  });
});
