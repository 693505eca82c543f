// A stage with a rate pot: the bundle carries the control into the firmware,
// pin map, checklist and plan.json of the targets that read it, and says so
// where a target does not.
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { buildAdcTable, travelChecklist } from "@/lib/engine";
import { GOLDEN_CASES } from "../../golden/cases";

const spec = GOLDEN_CASES.find((c) => c.name === "kept-pot-555")!.spec;
const files = buildBundleSources(spec);
const text = (p: string) => {
  const f = files.find((x) => x.path === p);
  if (!f) throw new Error(`no ${p} in ${files.map((x) => x.path).join(", ")}`);
  return String(f.content);
};
const plan = JSON.parse(text("plan.json")) as {
  control: unknown;
  targets: {
    folder: string;
    control?: { worstStepPpm?: number; steps?: number; kept?: false; note?: string };
  }[];
};

describe("kept rate pot in the bundle", () => {
  it("the AVR main.c is the ADC program: ADC0 (ATmega328P) / ADC1 (ATtiny85) with the datasheet ADPS", () => {
    // ATmega328P DS40002061 ADC chapter: MUX3:0 = 0 selects ADC0; 16 MHz / 128 = 125 kHz (50..200 kHz).
    const m = text("atmega328p/src/main.c");
    expect(m).toMatch(/ISR\(ADC_vect\)/);
    expect(m).toMatch(/ADPS2\) \| \(1 << ADPS1\) \| \(1 << ADPS0/);
    const t = text("attiny85/src/main.c");
    expect(t).toMatch(/ISR\(ADC_vect\)/);
  });

  it("the RP2040 main.c includes adc_control.h and polls it instead of the wfi loop", () => {
    const m = text("rp2040/src/main.c");
    expect(m).toContain('#include "adc_control.h"');
    expect(m).toMatch(/adc_control_init\(\);\s*for \(;;\) \{\s*adc_control_poll\(\);/);
    expect(m).not.toContain('"wfi"');
    expect(text("rp2040/src/adc_control.h")).toMatch(/PWM_CH_DIV\(ADJ_SLICE\)/);
  });

  it("the MSP430G2553 and PIC12F1840 include their ADC parts; the PIC's image part is assembly", () => {
    expect(text("msp430g2553/src/main.c")).toContain('#include "adc_control.h"');
    expect(text("msp430g2553/src/adc_control.h")).toMatch(/INCH_4 \| SHS_0/);
    expect(text("pic12f1840/src/main.asm")).toContain('#include "adc_control.inc"');
    expect(text("pic12f1840/src/adc_control.inc")).toMatch(/adj_pr2:\n\s+brw/);
    expect(text("pic12f1840/src/main.c")).toContain('#include "adc_control.h"');
    expect(plan.targets[4].control).toMatchObject({ steps: 64 });
    expect(plan.targets[5].control).toMatchObject({ steps: 64 });
  });

  it("a selector is read on the PIC12F1840 too: pin map rows RA4/RA5, one checklist line per position", () => {
    const sel = buildBundleSources({
      ...spec,
      control: { kind: "selector", field: "c", values: [100e-9, 220e-9] },
    });
    const read = (p: string) => String(sel.find((f) => f.path === p)!.content);
    expect(read("pic12f1840/CHECKLIST.md")).not.toMatch(/is not carried over by this firmware/);
    expect(read("pic12f1840/CHECKLIST.md")).toMatch(/Turn the selector to position 2 \(c = 220/);
    expect(read("pic12f1840/PINMAP.md")).toMatch(/switch position 1 .*\| RA4 \| 3 /); // 8-pin package pin 3 = RA4 (from memory)
    expect(read("pic12f1840/PINMAP.md")).toMatch(/switch position 2 .*\| RA5 \| 2 /);
    expect(read("pic12f1840/src/main.asm")).toContain('#include "selector_control.inc"');
    expect(sel.some((f) => f.path.endsWith("adc_control.h"))).toBe(false);
  });

  it("the PIC12F1840 refuses a fifth selector position naming control.values, and a crystal naming the target's clock", () => {
    // five free inputs do not exist on the 6-pin port: RA2 output, RA3 MCLR (DS40001441 pin allocation table)
    const five = { kind: "selector" as const, field: "c", values: [47e-9, 68e-9, 100e-9, 150e-9, 220e-9] };
    const pic = spec.targets[5];
    expect(pic.device).toBe("pic12f1840");
    expect(() => buildBundleSources({ ...spec, control: five, targets: [pic] })).toThrow(
      expect.objectContaining({
        field: "control.values",
        message: expect.stringMatching(/2 to 4 selector positions/),
      }),
    );
    const crystal = {
      ...spec,
      control: { kind: "selector" as const, field: "c", values: [100e-9, 220e-9] },
      targets: [{ ...pic, clockSource: "crystal", clockHz: 8e6 }],
    };
    expect(() => buildBundleSources(crystal)).toThrow(
      expect.objectContaining({ field: "targets.0.clockSource", message: expect.stringMatching(/RA4\/RA5/) }),
    );
  });

  it("every device refuses more selector positions than it has input pins: an engine error naming control.values", () => {
    // Pins per device as each part states them (its pin map rows); eight positions fit none of them.
    const eight = {
      kind: "selector" as const,
      field: "c",
      values: [22e-9, 33e-9, 47e-9, 68e-9, 100e-9, 150e-9, 220e-9, 330e-9],
    };
    for (const t of spec.targets) {
      let caught: unknown;
      try {
        buildBundleSources({ ...spec, control: eight, targets: [t] });
      } catch (e) {
        caught = e;
      }
      expect(caught, t.device).toMatchObject({
        name: "EngineError",
        code: "invalid-request",
        field: "control.values",
        message: expect.stringMatching(
          new RegExp(`target 1 \\(${t.device}\\) cannot keep the selector: .*2 to \\d`),
        ),
      });
    }
  });

  it("pin map names supply, wiper, ground and filter capacitor", () => {
    const pm = text("atmega328p/PINMAP.md");
    for (const role of ["supply (pot top)", "wiper", "ground (pot bottom)", "filter capacitor"])
      expect(pm).toContain(role);
    expect(pm).toMatch(/\| wiper \| PC0 \(ADC0\) \| 23 /); // ATmega328P PDIP-28 pin 23 = PC0 (from memory)
  });

  it("checklist has minimum, middle and maximum lines with the table's limits; plan.json the resolution", () => {
    const table = buildAdcTable({
      stage: spec.stage,
      control: spec.control,
      device: "atmega328p",
      clockHz: 16e6,
      timer: "TIMER1",
      adcBits: 10,
      steps: 64,
    });
    const lines = travelChecklist(table);
    const cl = text("atmega328p/CHECKLIST.md");
    expect(cl.match(/^\| P\d /gm)).toHaveLength(3);
    for (const l of lines) expect(cl).toContain(l.instruction);
    expect(plan.targets[0].control).toMatchObject({ steps: 64, worstStepPpm: table.worstStepPpm });
    expect(plan.control).toEqual(spec.control);
    // NE555 (TI SLFS022): T = ln2 (Ra + 2 Rb) C; the minimum step is Rb = 2.2 kΩ.
    expect(table.steps[0].wantS).toBeCloseTo(Math.LN2 * (1e3 + 2 * 2.2e3) * 100e-9, 9);
  });

  it("without a control the bundle is unchanged by this feature", () => {
    const plain = buildBundleSources({ ...spec, control: null });
    expect(plain.some((f) => f.path.endsWith("adc_control.h"))).toBe(false);
    expect(String(plain.find((f) => f.path === "atmega328p/src/main.c")!.content)).not.toMatch(/ADC_vect/);
  });

  it("a kept target planned on another timer is refused naming the target", () => {
    const t0 = { ...spec.targets[0], timer: "TIMER0" };
    expect(() => buildBundleSources({ ...spec, targets: [t0] })).toThrow(
      expect.objectContaining({ field: "targets.0", message: expect.stringMatching(/TIMER1/) }),
    );
  });
});
