// The compare page's register table. Two kinds of check:
// 1. Datasheet: ATmega328P fast PWM with TOP = ICR1 (Microchip DS40002061,
//    16.9.3 "Fast PWM Mode": f_OCnxPWM = f_clk_I/O / (N * (1 + TOP))), so at
//    16 MHz and 1 kHz, ICR1 = 16e6 / (N * 1000) - 1 with the plan's N
//    (15999 for N = 1); at 500 Hz, 16e6 / (N * 500) - 1.
// 2. The numbers must be the ones the firmware writes: every golden bundle
//    (each device with every timer and mode, and the triggered AVR cases) is
//    rendered and each row's value is read back from the comment the template
//    prints beside the write ("<why> -> 0x..").
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { registerChanges } from "@/lib/diff/registers";
import { planTarget } from "@/lib/engine";
import { GOLDEN_CASES } from "../../golden/cases";

const pwm = (periodS: number) => ({
  plans: [
    {
      target: {},
      plan: planTarget({
        device: "atmega328p",
        clockHz: 16e6,
        periodS,
        highS: periodS / 4,
        mode: "pwm",
        timer: "TIMER1",
      }),
      budget: null,
    },
  ],
});

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

describe("registerChanges", () => {
  it("gives the datasheet's TOP for fast PWM and marks it changed", () => {
    const a = pwm(1e-3);
    const b = pwm(2e-3);
    const [t] = registerChanges(a, b);
    expect(t.deviceName).toBe("ATmega328P");
    const icr = t.rows.find((r) => r.reg === "ICR1")!;
    expect(icr.before).toBe(16e6 / (a.plans[0].plan.divider * 1000) - 1);
    expect(icr.after).toBe(16e6 / (b.plans[0].plan.divider * 500) - 1);
    expect(icr.changed).toBe(true);
    expect(icr.why).toMatch(/TOP/);
    // the control register (WGM and CS bits) is the same on both sides
    expect(t.rows.find((r) => r.reg === "TCCR1B")!.changed).toBe(false);
  });

  it("lists a register only one side writes with a dash on the other", () => {
    const [t] = registerChanges({ plans: [] }, pwm(1e-3));
    expect(t.rows.length).toBeGreaterThan(0);
    expect(t.rows.every((r) => r.before === null && r.changed)).toBe(true);
  });

  it("says so when a target moved to another device", () => {
    const other = {
      plans: [{ plan: planTarget({ device: "attiny85", clockHz: 8e6, periodS: 1e-3, highS: 2.5e-4 }) }],
    };
    const [t] = registerChanges(pwm(1e-3), other);
    expect(t.note).toMatch(/moved from ATmega328P/);
    expect(t.rows.every((r) => r.before === null)).toBe(true);
  });

  for (const c of GOLDEN_CASES) {
    it(`shows the values the firmware of golden case ${c.name} writes`, () => {
      const files = buildBundleSources(c.spec);
      const planJson = JSON.parse(String(files.find((f) => f.path === "plan.json")!.content)) as {
        targets: { folder: string; plan: unknown }[];
      };
      const rev = { spec: c.spec, plans: planJson.targets.map((t) => ({ plan: t.plan })) };
      const table = registerChanges(rev, rev);
      expect(table).toHaveLength(planJson.targets.length);
      let checked = 0;
      let noted = 0;
      table.forEach((t, i) => {
        const folder = planJson.targets[i].folder;
        const plan = planJson.targets[i].plan as { start?: string };
        if (t.note) {
          noted++;
          const srcOf = (re: RegExp) =>
            files.filter((f) => f.path.startsWith(`${folder}/src/`) && re.test(String(f.content)));
          if (/rate pot's ADC firmware/.test(t.note)) {
            // the ADC program rewrites TOP and compare from its step table while running
            expect(srcOf(/\bADC/).length).toBeGreaterThan(0);
          } else if (/trimmer's calibration constant/.test(t.note)) {
            // the fixed firmware with TOP and compare written from TRIM_PERIOD_COUNTS
            expect(srcOf(/\(TRIM_PERIOD_COUNTS - 1u?\)/).length).toBeGreaterThan(0);
          } else if (/selector switch firmware/.test(t.note)) {
            expect(srcOf(/selector|position/i).length).toBeGreaterThan(0);
          } else {
            // triggered firmware of a device whose trigger registers are not tabled
            expect(t.note).toMatch(/triggered .* firmware's registers are not tabled/);
            expect(plan.start).toBeDefined();
            expect(plan.start).not.toBe("free");
          }
          return;
        }
        const src = files
          .filter((f) => f.path.startsWith(`${folder}/src/`))
          .map((f) => String(f.content))
          .join("\n");
        for (const r of t.rows) {
          expect(r.changed).toBe(false);
          if (plan.start && plan.start !== "free") {
            // triggered AVR firmware: plain writes, and the clock select as an asm operand
            if (/clock select/.test(r.why)) expect(src).toContain(`[cs] "M"(${r.after})`);
            else expect(src).toContain(`${r.reg} = ${r.expr};`);
          } else {
            const m = new RegExp(`${escape(r.why)} -> (0x[0-9A-F]+)`).exec(src);
            expect(m, `${folder} ${r.reg}: "${r.why}" not in the source`).not.toBeNull();
            expect(Number(m![1])).toBe(r.after);
          }
          checked++;
        }
      });
      // every target is either checked against its source or carries a note that says why not
      expect(checked + noted).toBeGreaterThan(0);
      if (noted < table.length) expect(checked).toBeGreaterThan(0);
    });
  }
});
