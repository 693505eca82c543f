// The RP2040 kept selector part's own limits (lib/bundle/selector-rp2040.ts),
// checked on the refusal without a compiler so the fast mutation set judges
// them. The part runs one PWM slice edge-aligned (RP2040 datasheet, 4.5 PWM:
// CSR.PH_CORRECT = 0) and reads the switch on GPIO2..GPIO7 with pad pull-ups;
// which GPIOs it uses is the product's own choice (common practice, no source).
import { describe, expect, it } from "vitest";
import { buildSelectorTable } from "@/lib/engine";
import { renderRp2040Selector } from "@/lib/bundle/selector-rp2040";

const table = buildSelectorTable({
  stage: { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 },
  control: { kind: "selector", field: "c", values: [100e-9, 220e-9] },
  device: "rp2040",
  clockHz: 12e6,
  clockSource: "xosc",
});
const render = (t: typeof table) => () =>
  renderRp2040Selector({ table: t, startIndex: 0, controlText: "selector as C" });

describe("RP2040 kept selector part", () => {
  it("takes the edge-aligned PWM table plan", () => {
    expect(table.plan.mode).toBe("pwm");
    expect(render(table)).not.toThrow();
  });

  it("refuses a plan that is not PWM, by its message", () => {
    const isr = { ...table, plan: { ...table.plan, mode: "isr" as const } };
    expect(render(isr)).toThrow("The selector part runs on RP2040 edge-aligned PWM plans.");
  });

  it("refuses another device's PWM table plan, by its message", () => {
    // built here, not while the file loads: a refusal then fails this test only
    const avr = buildSelectorTable({
      stage: { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 },
      control: { kind: "selector", field: "c", values: [100e-9, 220e-9] },
      device: "atmega328p",
      clockHz: 16e6,
      clockSource: "crystal",
    });
    expect(avr.plan.mode).toBe("pwm");
    expect(render(avr)).toThrow("The selector part runs on RP2040 edge-aligned PWM plans.");
  });

  it("refuses an output on one of the switch inputs, naming the GPIO", () => {
    // two positions read GPIO2 and GPIO3
    const onInput = { ...table, plan: { ...table.plan, pin: { ...table.plan.pin, port: "GP3", gpio: 3 } } };
    expect(render(onInput)).toThrow("targets: GPIO3 is a selector input.");
  });
});
