// A kept selector switch on the MSP430G2553 (golden case kept-selector-555):
// the bundle's msp430g2553 folder (src/main.c with src/selector_control.h,
// built by its own Makefile) runs in mspdebug's simulator (Debian mspdebug
// 0.22). The simulator has no port model that follows the pull resistors: the
// contact state is the byte put at P2IN (0x0028, SLAS735 peripheral map)
// before the run (a byte written there stays: the image never writes P2IN),
// so the image's own reading, debounce and table lookup run on it; the input
// set-up (PxSEL = 0, PxDIR = 0, PxREN = 1 with PxOUT = 1: pull-up, SLAU144
// Digital I/O) is checked from the IO writes the image makes. A move between
// positions needs P2IN changed mid-run, which this simulator run cannot do:
// that path is the same code as on the RP2040 and AVRs, proven in rp2040js and
// simavr (selector-rp2040-emulator, selector-avr-simavr).
// Period: the running counter's wrap (TAR sampled) and TA0CCR1 (OUTMOD_7),
// against the old stage, NE555 astable T = ln2*(Ra + 2*Rb)*C, high =
// ln2*(Ra + Rb)*C (TI SLFS022), C = the selector's value; one timer count.
// Planted fault (kept as a negative case): position 1 read on P2.5 instead of P2.0.
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { buildMsp430, type Plant } from "@/tests/tools/msp430-build";
import { lastWrite, periodsFromSamples, sampleTimer } from "@/tests/tools/mspdebug-sim";
import { GOLDEN_CASES } from "../../golden/cases";

const spec = GOLDEN_CASES.find((c) => c.name === "kept-selector-555")!.spec;
const files = buildBundleSources(spec);
const planJson = JSON.parse(String(files.find((f) => f.path === "plan.json")!.content)) as {
  targets: {
    folder: string;
    plan: { divider: number; clockHz: number };
    control: { divider: number; clockHz: number; values: number[]; periodCounts: number[] };
  }[];
};
const t = planJson.targets.find((x) => x.folder === "msp430g2553")!;
const countS = t.control.divider / t.control.clockHz;
const STORED = 1; // c = 100 nF, the stage's stored value: position 2
// SLAS735 peripheral file map: P2IN 0x28, P2OUT 0x29, P2DIR 0x2A, P2SEL 0x2E, P2REN 0x2F
const P2IN = 0x28;
const P2OUT = 0x29;
const P2DIR = 0x2a;
const P2SEL = 0x2e;
const P2REN = 0x2f;

const oldStage = (c: number) => ({
  periodS: Math.LN2 * (1e3 + 2 * 10e3) * c,
  highS: Math.LN2 * (1e3 + 10e3) * c,
});

function build(plant?: Plant): string {
  const b = buildMsp430(files, "msp430g2553", plant);
  if (b.make.status !== 0) throw new Error(`make failed:\n${b.make.stderr}${b.make.stdout}`);
  return b.elf;
}

/** P2IN with the given contacts closed (low), the others pulled up. */
const contacts = (closed: number[]) => ({
  memory: [{ addr: P2IN, bytes: [0xff & ~closed.reduce((m, b) => m | (1 << b), 0)] }],
});

function judge(elf: string, closed: number[], index: number): string[] {
  const longest = Math.max(...t.control.periodCounts);
  const spacing = 2 * Math.floor(t.control.periodCounts[index] / 6) + 1;
  const { samples } = sampleTimer(elf, 60_000 + 2 * longest, spacing, 12, contacts(closed));
  const periods = periodsFromSamples(samples, 1);
  const want = oldStage(t.control.values[index]);
  if (periods.length < 2 || periods.some((p) => p !== periods[0]))
    return [`counter periods ${periods.join(", ")}`];
  const out: string[] = [];
  const last = samples[samples.length - 1];
  if (Math.abs(periods[0] * countS - want.periodS) > countS)
    out.push(`period ${periods[0] * countS} s, the old stage ${want.periodS} s`);
  if (Math.abs(last.ccr[1] * countS - want.highS) > countS)
    out.push(`high ${last.ccr[1] * countS} s, the old stage ${want.highS} s`);
  return out;
}

const elf = build();

describe("MSP430G2553 keeps the selector switch (mspdebug sim, P2IN set)", () => {
  it("inputs P2.0..P2.2 with the pull-up: P2SEL 0, P2DIR 0, P2REN 1, P2OUT 1", () => {
    const { io } = sampleTimer(elf, 3000, 97, 1, contacts([0]));
    const bits = (addr: number) => (lastWrite(io, addr) ?? -1) & 0x07;
    expect([bits(P2SEL), bits(P2DIR), bits(P2REN), bits(P2OUT)]).toEqual([0, 0, 7, 7]);
  });

  for (const k of [0, 1, 2])
    it(`position ${k + 1} closed: the old stage's period for that capacitor within one count`, () => {
      expect(judge(elf, [k], k)).toEqual([]);
    });

  it("no contact or two contacts at power-up: the stored value's position", () => {
    expect(judge(elf, [], STORED)).toEqual([]);
    expect(judge(elf, [0, 2], STORED)).toEqual([]);
  });

  it("planted fault: position 1 read on the wrong pin is caught", () => {
    const bad = build({
      file: "src/selector_control.h",
      from: "0u, /* position 1 */",
      to: "5u, /* position 1 */",
    });
    expect(judge(bad, [0], 0).length).toBeGreaterThan(0);
  });
});
