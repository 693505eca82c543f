// A kept selector switch on the PIC12F1840 (golden case kept-selector-555):
// the bundle's pic12f1840 folder (src/main.asm with src/selector_control.inc,
// built by its own Makefile with gpasm) runs in gpsim (Debian gpsim 0.31,
// processor p12f1840). gpsim models the weak pull-ups (an open RA pin with
// WPUA set and nWPUEN = 0 reads 1, tried on this machine); a closed contact
// is a gpsim asynchronous_stimulus holding the pin at 0 from cycle 1, and a
// move or release is a level change at a given instruction cycle.
// Expected values:
// - each position's period and high time are the table's plan (period
//   counts x prescale x 4 Tosc, DS40001441 CCP chapter, PWM period =
//   (PR2 + 1) x 4 x Tosc x prescale), within half a count plus the
//   emulator's step (the pin is sampled once per instruction, at most two
//   cycles); the clock is decoded from the image's configuration words and
//   OSCCON (pic12f1840-tables.ts) because gpsim counts instruction cycles;
// - the plan itself is the old stage's period within half a count: NE555
//   astable T = ln2 (RA + 2 RB) C, high = ln2 (RA + RB) C (TI SLFS022), C the
//   position's capacitor;
// - input set-up read back: ANSELA bits clear, TRISA bits set, WPUA bits set,
//   OPTION_REG nWPUEN (bit 7) = 0 (DS40001441 I/O Ports chapter, Register
//   OPTION_REG); RA2 stays the output.
// Planted faults (kept as negative cases): position 1 read on RA0 instead of RA4;
// the weak pull-ups left off.
import path from "node:path";
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleFile } from "@/lib/bundle";
import { syntaxCheckFolder } from "@/tests/tools/c-check";
import { buildPic, configWords, pinTiming, registersAt, tracePin } from "@/tests/tools/gpsim";
import { systemClockHz } from "@/tests/tools/pic12f1840-tables";
import { GOLDEN_CASES } from "../../golden/cases";

const spec = GOLDEN_CASES.find((c) => c.name === "kept-selector-555")!.spec;
const files = buildBundleSources(spec);
const planJson = JSON.parse(String(files.find((f) => f.path === "plan.json")!.content)) as {
  targets: {
    folder: string;
    control: {
      divider: number;
      clockHz: number;
      values: number[];
      periodCounts: number[];
      highCounts: number[];
    };
  }[];
};
const t = planJson.targets.find((x) => x.folder === "pic12f1840")!;
const tcyPerCount = t.control.divider / 4;
const MOVE = [
  ...contact("porta4", "c1", [{ cycle: 200_000, level: 1 }]),
  ...contact("porta1", "c3", [
    { cycle: 2, level: 1 },
    { cycle: 200_000, level: 0 },
  ]),
];
const STORED = 1; // c = 100 nF, the stage's stored value: position 2
// contacts in position order (selector-pic12f1840.ts): RA4, RA5, RA1
const PIN = ["porta4", "porta5", "porta1"];

const oldStage = (c: number) => ({
  periodS: Math.LN2 * (1e3 + 2 * 10e3) * c,
  highS: Math.LN2 * (1e3 + 10e3) * c,
});

/** A contact on `pin`: level 0 from cycle 1, then each change. */
function contact(pin: string, name: string, changes: { cycle: number; level: 0 | 1 }[] = []): string[] {
  const all = [{ cycle: 1, level: 0 }, ...changes];
  return [
    "stimulus asynchronous_stimulus",
    "initial_state 0",
    "start_cycle 0",
    `period ${all[all.length - 1].cycle + 10_000_000}`,
    `{ ${all.map((c) => `${c.cycle}, ${c.level}`).join(", ")} }`,
    `name ${name}`,
    "end",
    `node ${name}_node`,
    `attach ${name}_node ${name} ${pin}`,
  ];
}

function build(plant?: (inc: string) => string): string {
  let edited: BundleFile[] = files;
  if (plant) {
    edited = files.map((f) =>
      f.path === "pic12f1840/src/selector_control.inc" ? { ...f, content: plant(String(f.content)) } : f,
    );
    if (edited.every((f, i) => f.content === files[i].content))
      throw new Error("planted fault changed nothing in selector_control.inc");
  }
  return buildPic(edited, "pic12f1840");
}

/** Problems of the output from `fromCycle` on against position `index`'s plan (empty when it agrees). */
function judge(dir: string, setup: string[], index: number, fromCycle = 200_000): string[] {
  const steps = Math.ceil((4 * t.control.periodCounts[index] * tcyPerCount) / 1.5);
  const timing = pinTiming(tracePin(dir, 2, fromCycle, steps, setup));
  if (!timing) return ["no PWM on RA2"];
  const { OSCCON } = registersAt(dir, 1000, ["OSCCON"], setup);
  const { config1, config2 } = configWords(path.join(dir, "build/firmware.hex"));
  const hz = systemClockHz(config1, config2, OSCCON, 0);
  const countS = t.control.divider / hz;
  const tol = countS / 2 + (2 * 4) / hz;
  const periodS = (timing.periodCycles * 4) / hz;
  const highS = (timing.highCycles * 4) / hz;
  const wantS = t.control.periodCounts[index] * countS;
  const wantHighS = t.control.highCounts[index] * countS;
  const out: string[] = [];
  if (Math.abs(periodS - wantS) > tol)
    out.push(`period ${periodS} s, position ${index + 1} plans ${wantS} s`);
  if (Math.abs(highS - wantHighS) > tol)
    out.push(`high ${highS} s, position ${index + 1} plans ${wantHighS} s`);
  return out;
}

/** The contacts' input set-up read back after start-up (DS40001441 I/O Ports chapter). */
function inputProblems(d: string): string[] {
  const r = registersAt(d, 20_000, ["ANSELA", "TRISA", "WPUA", "OPTION_REG", "PORTA"]);
  const mask = 0x32; // RA5, RA4, RA1
  const out: string[] = [];
  if ((r.ANSELA & mask) !== 0) out.push(`ANSELA ${r.ANSELA}: a contact pin is analog`);
  if ((r.TRISA & mask) !== mask) out.push(`TRISA ${r.TRISA}: a contact pin is an output`);
  if ((r.TRISA & 0x04) !== 0) out.push(`TRISA ${r.TRISA}: RA2 is not the output`);
  if ((r.WPUA & mask) !== mask) out.push(`WPUA ${r.WPUA}: a contact pin has no pull-up`);
  if ((r.OPTION_REG & 0x80) !== 0) out.push(`OPTION_REG ${r.OPTION_REG}: nWPUEN set, pull-ups off`);
  // no contact closed: the pull-ups hold the three inputs high
  if ((r.PORTA & mask) !== mask) out.push(`PORTA ${r.PORTA}: an open contact pin reads low`);
  return out;
}

const dir = build();

describe("PIC12F1840 keeps the selector switch (gpsim, contacts as stimuli)", () => {
  it("each position's plan is the old stage's period and high time within half a count (NE555 formula)", () => {
    const countS = t.control.divider / t.control.clockHz;
    t.control.values.forEach((c, i) => {
      expect(Math.abs(t.control.periodCounts[i] * countS - oldStage(c).periodS)).toBeLessThanOrEqual(
        countS / 2,
      );
      expect(Math.abs(t.control.highCounts[i] * countS - oldStage(c).highS)).toBeLessThanOrEqual(countS / 2);
    });
  });

  it("inputs RA4, RA5, RA1: digital, input, weak pull-up on; RA2 the output", () => {
    expect(inputProblems(dir)).toEqual([]);
  });

  it("planted fault: the weak pull-ups left off (nWPUEN not cleared) is caught", () => {
    const bad = build((inc) => inc.replace(/\n\s+bcf\s+OPTION_REG, NOT_WPUEN/, ""));
    expect(inputProblems(bad).join("; ")).toMatch(/OPTION_REG/);
  });

  for (const k of [0, 1, 2])
    it(`position ${k + 1} closed (${PIN[k]} low): the plan's period within half a count`, () => {
      expect(judge(dir, contact(PIN[k], "c1"), k)).toEqual([]);
    });

  it("no contact and two contacts at power-up: the stored value's position", () => {
    expect(judge(dir, [], STORED)).toEqual([]);
    expect(judge(dir, [...contact(PIN[0], "c1"), ...contact(PIN[2], "c3")], STORED)).toEqual([]);
  });

  // One gpsim run per test (each takes tens of seconds on a busy machine).
  it("a move from position 1 to 3: position 1 before the move", () => {
    expect(judge(dir, MOVE, 0, 120_000)).toEqual([]);
  });
  it("a move from position 1 to 3: still position 1 inside the 20 ms debounce", () => {
    // 3.75 ms after the move (16 MHz: 4000 instruction cycles a ms)
    expect(judge(dir, MOVE, 0, 215_000)).toEqual([]);
  });
  it("a move from position 1 to 3: position 3 once held through the debounce", () => {
    expect(judge(dir, MOVE, 2, 340_000)).toEqual([]);
  });
  it("a release (no contact) keeps the last position", () => {
    const release = contact(PIN[0], "c1", [{ cycle: 200_000, level: 1 }]);
    expect(judge(dir, release, 0, 340_000)).toEqual([]);
  });

  it("main.c with selector_control.h (the same steps for the vendor's C compiler) passes the syntax check", () => {
    const r = syntaxCheckFolder(files, "pic12f1840");
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
  });

  it("planted fault: position 1 read on RA0 instead of RA4 is caught", () => {
    const bad = build((inc) => inc.replace(/btfss\s+sel_low, 4(\s+; position 1)/, "btfss   sel_low, 0$1"));
    expect(judge(bad, contact(PIN[0], "c1"), 0).length).toBeGreaterThan(0);
  });

  it("planted fault: no debounce (a reading taken after one sample) is caught inside the 20 ms", () => {
    const bad = build((inc) => inc.replace(/movlw\s+20(\n\s+movwf\s+sel_cnt)/, "movlw   1$1"));
    expect(judge(bad, MOVE, 0, 215_000).length).toBeGreaterThan(0);
  });
});
