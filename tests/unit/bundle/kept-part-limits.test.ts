// Limits the kept-control firmware parts state themselves, checked on the
// rendered text or the refusal, without a compiler, so the fast mutation set
// judges them (the emulator runs are under tests/unit/firmware/).
import { describe, expect, it } from "vitest";
import { buildBundleSources } from "@/lib/bundle";
import { buildAdcTable, buildSelectorTable } from "@/lib/engine";
import { GOLDEN_CASES } from "../../golden/cases";
import { renderAtmega328pAdc, renderAttiny85Adc } from "@/lib/bundle/adc-avr";
import { renderStm32g031Adc } from "@/lib/bundle/adc-stm32g031";
import { renderStm32g031Selector } from "@/lib/bundle/selector-stm32g031";
import { expectEngineError } from "../engine/expect-engine-error";

const stage = { kind: "timer555-astable", supplyV: 5, ra: 1e3, rb: 10e3, c: 100e-9 } as const;
const pot = { kind: "pot", field: "rb", seriesR: 2.2e3, trackR: 47e3, taper: "linear" } as const;

describe("ATmega328P rate pot: ADC channel", () => {
  // ATmega328P datasheet DS40002061, pin configurations: the PDIP-28 package has
  // ADC0..ADC5 on PC0..PC5; ADC6 and ADC7 exist only on the TQFP and QFN packages.
  const table = buildAdcTable({
    stage,
    control: pot,
    device: "atmega328p",
    clockHz: 16e6,
    adcBits: 10,
    steps: 64,
  });

  it("ADC5 is taken: ADMUX = AVcc reference (REFS1:0 = 01) with MUX3:0 = 5", () => {
    expect(renderAtmega328pAdc({ table, channel: 5, controlText: "rate pot as Rb" })).toContain(
      "ADMUX = (1 << REFS0) | 5;",
    );
  });

  it.each([6, -1, 1.5])("channel %d is refused naming the package's ADC0..ADC5", (channel) => {
    expect(() => renderAtmega328pAdc({ table, channel, controlText: "rate pot as Rb" })).toThrow(
      "channel: the PDIP-28 ATmega328P has ADC0..ADC5 on PC0..PC5.",
    );
  });
});

describe("ATtiny85 rate pot: the plan it runs on", () => {
  // the part drives OC0B from Timer0 fast PWM (lib/bundle/adc-avr.ts); any other plan is refused by its message
  const table = buildAdcTable({
    stage,
    control: pot,
    device: "attiny85",
    clockHz: 8e6,
    timer: "TIMER0",
    adcBits: 10,
    steps: 64,
  });

  it("a Timer0 fast PWM table is rendered; an interrupt plan or Timer1 is refused", () => {
    expect(() => renderAttiny85Adc({ table, controlText: "rate pot as Rb" })).not.toThrow();
    for (const over of [{ mode: "isr" as const }, { timer: "TIMER1" }])
      expect(() =>
        renderAttiny85Adc({
          table: { ...table, plan: { ...table.plan, ...over } },
          controlText: "rate pot as Rb",
        }),
      ).toThrow("The ADC control firmware runs on ATtiny85 Timer0 fast PWM plans.");
  });
});

describe("STM32G031 kept parts", () => {
  it("the rate pot's ADC runs on PCLK/2 at 16 MHz: ADC_CFGR2 CKMODE = 01", () => {
    // RM0444 ADC_CFGR2 CKMODE[1:0] in bits 31:30: 01 = PCLK/2, 10 = PCLK/4 (from memory);
    // 8 MHz is inside the ADC clock range the part states (0.14..35 MHz, datasheet, from memory).
    const table = buildAdcTable({
      stage,
      control: pot,
      device: "stm32g031",
      clockHz: 16e6,
      adcBits: 12,
      steps: 64,
    });
    const h = renderStm32g031Adc({ table, controlText: "rate pot as Rb" });
    expect(h).toContain("ADC_CFGR2 = (1u << 30);");
    expect(h).toContain("ADC clock: PCLK/2 = 8000000 Hz (CKMODE = 1), inside 140000..35000000 Hz.");
  });

  it("the rate pot's ADC part refuses a plan that is not edge-aligned PWM, by its message", () => {
    // the part drives TIM2_CH1 from the table's PWM compare values (lib/bundle/adc-stm32g031.ts)
    const table = buildAdcTable({
      stage,
      control: pot,
      device: "stm32g031",
      clockHz: 16e6,
      adcBits: 12,
      steps: 64,
    });
    expect(() => renderStm32g031Adc({ table, controlText: "rate pot as Rb" })).not.toThrow();
    for (const over of [{ mode: "isr" as const }, { mode: "toggle" as const }, { modeFactor: 2 as const }])
      expect(() =>
        renderStm32g031Adc({
          table: { ...table, plan: { ...table.plan, ...over } },
          controlText: "rate pot as Rb",
        }),
      ).toThrow("The ADC control part runs on STM32G031 edge-aligned PWM plans.");
  });

  it("the selector part refuses a plan that is not edge-aligned PWM, by its message", () => {
    const table = buildSelectorTable({
      stage,
      control: { kind: "selector", field: "c", values: [100e-9, 220e-9] },
      device: "stm32g031",
      clockHz: 16e6,
    });
    expect(() =>
      renderStm32g031Selector({ table, startIndex: 0, controlText: "selector as C" }),
    ).not.toThrow();
    const isr = { ...table, plan: { ...table.plan, mode: "isr" as const } };
    expect(() =>
      renderStm32g031Selector({ table: isr, startIndex: 0, controlText: "selector as C" }),
    ).toThrow("The selector part runs on STM32G031 edge-aligned PWM plans.");
  });
});

describe("RP2040 kept selector on a travel too wide for edge-aligned PWM", () => {
  // 1 nF to 100 uF on the 555 astable at 12 MHz: the table plan turns phase-correct (modeFactor 2)
  // for the longest position. Before, the part's plain Error reached the API as a server error.
  it("is refused as bad input naming the target, not thrown as a plain error", () => {
    const kept = GOLDEN_CASES.find((c) => c.name === "kept-pot-555")!.spec;
    const rp = kept.targets.find((t) => t.device === "rp2040")!;
    const err = expectEngineError(
      () =>
        buildBundleSources({
          ...kept,
          control: { kind: "selector", field: "c", values: [1e-9, 1e-4] },
          targets: [rp],
        }),
      "invalid-request",
    );
    expect(err.field).toBe("targets.0");
    expect(err.message).toMatch(
      /^target 1 \(rp2040\) cannot keep the selector: the longest position needs phase-correct PWM/,
    );
  });
});

describe("A kept selector position the second target's timer cannot reach", () => {
  // NE555 astable (TI NE555 datasheet): T = ln 2 (Ra + 2 Rb) C, so 4.7 uF with Ra = 1k,
  // Rb = 10k gives 68.4 ms. The ATtiny85's 8-bit Timer0 at 8 MHz reaches at most
  // 256 x 1024 / 8 MHz = 32.8 ms (DS2586, Timer/Counter0 prescaler up to clk/1024);
  // the ATmega328P's 16-bit Timer1 at 16 MHz reaches 4.19 s (DS40002061). The
  // refusal names the target that cannot keep it, counted from 1 in the text.
  it("is refused naming target 2 (targets.1), the ATtiny85", () => {
    const kept = GOLDEN_CASES.find((c) => c.name === "kept-pot-555")!.spec;
    const mega = kept.targets.find((t) => t.device === "atmega328p")!;
    const tiny = kept.targets.find((t) => t.device === "attiny85")!;
    const control = { kind: "selector", field: "c", values: [100e-9, 4.7e-6] } as const;
    expect(Math.LN2 * (1e3 + 2 * 10e3) * 4.7e-6).toBeGreaterThan((256 * 1024) / 8e6);
    expect(() => buildBundleSources({ ...kept, control, targets: [mega] })).not.toThrow();
    const err = expectEngineError(
      () => buildBundleSources({ ...kept, control, targets: [mega, tiny] }),
      "invalid-request",
    );
    expect(err.field).toBe("targets.1");
    expect(err.message).toMatch(/^target 2 \(attiny85\) cannot keep the selector: The longest period/);
  });
});
