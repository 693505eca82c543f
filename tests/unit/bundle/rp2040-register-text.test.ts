// RP2040 register addresses and fields the bundle writes as text, checked
// without a compiler or rp2040js so the fast mutation set judges them (the
// emulator runs are tests/unit/firmware/trigger-rp2040-emulator.test.ts and
// adc-rp2040-emulator.test.ts).
// Sources:
// - RP2040 datasheet, 2.19 GPIO, IO_BANK0 register list: GPIO0..29 STATUS/CTRL
//   pairs from offset 0x000 (30 x 8 bytes), then INTR0..3 at 0x0f0..0x0fc and
//   PROC0_INTE0..3 at 0x100..0x10c, eight GPIOs of four bits (LEVEL_LOW,
//   LEVEL_HIGH, EDGE_LOW, EDGE_HIGH) per register; IO_BANK0 at 0x40014000.
//   Checked against the layout of the public pico-sdk header
//   hardware/structs/iobank0.h (io[30] {status, ctrl}, intr[4], proc0 inte[4]).
// - RP2040 datasheet, 2.1.2 atomic register access: +0x2000 set, +0x3000 clear
//   aliases (from memory).
// - RP2040 datasheet, 4.5 PWM, CHx_DIV: 8.4 fixed point, INT in bits 11:4,
//   FRAC in bits 3:0 (reset 0x010 = 1.0); checked against pico-sdk
//   hardware/regs/pwm.h (PWM_CH0_DIV_INT_BITS 0xff0, DIV_BITS 0xfff).
//   INT 1..255 with FRAC 0..15 gives 1.0 .. 255.9375 in 1/16 steps.
// - RP2040 datasheet, 2.18 PLL: f = (fref / REFDIV) * FBDIV / (POSTDIV1 * POSTDIV2),
//   fref the 12 MHz crystal (XOSC).
import { describe, expect, it } from "vitest";
import { buildAdcTable, planTarget, type AdcTable } from "@/lib/engine";
import type { BundlePlan } from "@/lib/bundle";
import { rp2040TriggerView } from "@/lib/bundle/trigger-rp2040";
import { renderRp2040Adc } from "@/lib/bundle/adc-rp2040";
import { rpClock } from "@/lib/bundle/device-rp2040";
import { expectEngineError } from "../engine/expect-engine-error";

const IO_BANK0 = 0x40014000;
const INTR0 = 0x0f0;
const PROC0_INTE0 = 0x100;
const addr = (n: number) => `0x${n.toString(16).toUpperCase().padStart(8, "0")}u`;

const triggered = planTarget({
  device: "rp2040",
  clockHz: 12e6,
  clockSource: "xosc",
  periodS: 0.02,
  highS: 0.001,
  start: "trigger",
  delayS: 0.004,
  edge: "rising",
}) as BundlePlan;
const withInput = (gpio: number): BundlePlan => ({
  ...triggered,
  input: { ...triggered.input!, port: `GPIO${gpio}`, gpio, bit: gpio },
});

describe("RP2040 trigger input registers", () => {
  it.each([3, 12, 21, 29])("GPIO%i: INTRn, PROC0_INTEn set/clear aliases and its EDGE_HIGH bit", (gpio) => {
    const v = rp2040TriggerView(withInput(gpio))!;
    const n = Math.floor(gpio / 8); // eight GPIOs per INTR / INTE register
    expect(v.intReg).toBe(n);
    expect(v.intrAddr).toBe(addr(IO_BANK0 + INTR0 + 4 * n));
    expect(v.inteSet).toBe(addr(IO_BANK0 + 0x2000 + PROC0_INTE0 + 4 * n));
    expect(v.inteClr).toBe(addr(IO_BANK0 + 0x3000 + PROC0_INTE0 + 4 * n));
    // EDGE_HIGH is bit 3 of the GPIO's four-bit group
    expect(v.edgeMask).toBe(addr((1 << (4 * (gpio % 8) + 3)) >>> 0));
  });

  it("the plan's own input (GPIO15) reads INTR1 at 0x400140F4", () => {
    const v = rp2040TriggerView(triggered)!;
    expect(v.inGpio).toBe(15);
    expect(v.intrAddr).toBe("0x400140F4u");
    expect(v.inteSet).toBe("0x40016104u");
  });

  it.each([
    ["output", { pin: { ...triggered.pin, port: "GP0", gpio: undefined } }, "GP0 / GPIO15"],
    ["input", { input: { ...triggered.input!, port: "GP15", gpio: undefined } }, "GPIO0 / GP15"],
  ] as const)(
    "an %s pin that is not GPIOn is refused naming both pins, on the timer field",
    (_, over, pins) => {
      const err = expectEngineError(
        () => rp2040TriggerView({ ...triggered, ...over } as BundlePlan),
        "invalid-request",
      );
      expect(err.field).toBe("timer");
      expect(err.message).toBe(`rp2040: pins ${pins}`);
    },
  );
});

/** A 555 astable whose Rb is a rate pot, kept on the RP2040 at 12 MHz (example circuit). */
const potTable = () =>
  buildAdcTable({
    stage: { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 },
    control: { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" },
    device: "rp2040",
    clockHz: 12e6,
    clockSource: "xosc",
    adcBits: 12,
    steps: 64,
  });

describe("RP2040 rate-pot PWM divider (CHx_DIV 8.4)", () => {
  const table = potTable();
  const withDivider = (divider: number): AdcTable => ({ ...table, plan: { ...table.plan, divider } });
  const header = (divider: number) =>
    renderRp2040Adc({ table: withDivider(divider), controlText: "rate pot as Rb" });

  it.each([
    [1, 1, 0],
    [2.5, 2, 8],
    [255, 255, 0],
    [255.9375, 255, 15], // the largest: INT 255, FRAC 15 (DIV = 0xFFF)
  ])("divider %d is written as INT %i, FRAC %i", (divider, int, frac) => {
    expect(header(divider)).toContain(
      `PWM_CH_DIV(ADJ_SLICE) = (${int}u << 4) | ${frac}u; /* DIV = ${divider} */`,
    );
  });

  it.each([0.9375, 256, 1.03])(
    "divider %d does not fit CHx_DIV and is refused naming the register's range",
    (d) => {
      expect(() => header(d)).toThrow(`divider ${d}: the PWM DIV register takes 1..255 in 1/16 steps.`);
    },
  );
});

describe("RP2040 clock set-up without a named clock source", () => {
  const plan = (clockHz: number) => ({ ...triggered, clockSource: undefined, clockHz }) as BundlePlan;

  it("12 MHz is the crystal itself, no PLL", () => {
    expect(rpClock(plan(12e6))).toEqual({ kind: "xosc" });
  });

  it("125 MHz comes from PLL_SYS on the 12 MHz crystal", () => {
    const c = rpClock(plan(125e6));
    expect(c.kind).toBe("pll");
    expect((12e6 / c.refdiv!) * c.fbdiv!).toBe(c.vcoHz);
    expect(c.vcoHz! / (c.postdiv1! * c.postdiv2!)).toBe(125e6);
  });

  it("a named crystal at another frequency is refused on clockHz", () => {
    const err = expectEngineError(
      () => rpClock({ ...plan(125e6), clockSource: "xosc" }),
      "clock-out-of-range",
    );
    expect(err.field).toBe("clockHz");
    expect(err.message).toBe("rp2040: the crystal runs at 12000000 Hz, not 125000000 Hz");
  });
});

describe("RP2040 rate-pot ADC input (CS.AINSEL)", () => {
  // RP2040 datasheet, 4.9 ADC: five inputs, AIN0..3 on GPIO26..29 and input 4 the
  // on-chip temperature sensor (no pin); pico-sdk adc_select_input() documents
  // 0..3 as GPIO26..29 and 4 as the temperature sensor. A wiper can only reach 0..3.
  const table = potTable();
  const header = (channel: number) => renderRp2040Adc({ table, channel, controlText: "rate pot as Rb" });

  it("ADC3 is the last pin input: AINSEL = 3 on GPIO29", () => {
    const h = header(3);
    expect(h).toContain("(3u << 12) | ADC_CS_START_ONCE; /* AINSEL = 3 */");
    expect(h).toContain("PADS_BANK0_GPIO(29) = (1u << 7);");
  });

  it.each([4, -1, 1.5])("channel %d is refused naming ADC0..ADC3 on GPIO26..29", (channel) => {
    expect(() => header(channel)).toThrow("channel: ADC0..ADC3 (GPIO26..29).");
  });
});
