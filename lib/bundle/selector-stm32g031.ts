// STM32G031 firmware part that keeps the old stage's selector switch: one
// input per position on PA5..PA7 (GPIOx_PUPDR pull-up, the switch's common
// contact to ground, so the selected position reads low), debounced on
// SysTick, and the engine's selector table as ARR/CCRx per position of the
// plan's TIM2/TIM3 channel. Rendered from templates/stm32g031/selector-control.h.hbs.
// Facts: RM0444 GPIO (MODER 00 input, PUPDR 01 pull-up, IDR) and
// general-purpose timers (ARPE/OCxPE preload, UG). TSSOP-20 pins from memory.
import type { SelectorTable } from "@/lib/engine";
import { stm32g031View } from "./device-stm32g031";
import { render } from "./render";
import {
  checkPositionCount,
  SELECTOR_DEBOUNCE_MS,
  selectorWiringLines,
  type WiringLine,
} from "./selector-common";
import type { BundlePlan } from "./types";

/** Input pins in position order: PA5, PA6, PA7 (TSSOP-20 pins 11, 12, 13; from memory). */
const STM32_SELECTOR_PINS = [
  { bit: 5, packagePin: 11 },
  { bit: 6, packagePin: 12 },
  { bit: 7, packagePin: 13 },
] as const;

export function stm32g031SelectorWiring(
  table: SelectorTable,
  valueText: (v: number) => string,
): WiringLine[] {
  const inputs = STM32_SELECTOR_PINS.map((p) => ({ name: `PA${p.bit}`, packagePin: p.packagePin }));
  return selectorWiringLines(table, valueText, inputs, "internal pull-up (PUPDR)", {
    role: "switch common contact to ground",
    pin: "VSS/VSSA",
    packagePin: 5,
  });
}

export function renderStm32g031Selector({
  table,
  startIndex,
  controlText,
}: {
  table: SelectorTable;
  startIndex: number;
  controlText: string;
}): string {
  const plan = table.plan as unknown as BundlePlan;
  if (plan.device !== "stm32g031" || plan.mode !== "pwm" || plan.modeFactor !== 1)
    throw new Error("The selector part runs on STM32G031 edge-aligned PWM plans.");
  const n = checkPositionCount(table, STM32_SELECTOR_PINS.length, "the STM32G031 part", "PA5..PA7");
  const pins = STM32_SELECTOR_PINS.slice(0, n);
  if (pins.some((p) => plan.pin.port === `PA${p.bit}`))
    throw new Error(`targets: ${plan.pin.port} is a selector input.`);
  const x = stm32g031View(plan).extra as { tim: string; ch: number };
  const hex = (v: number) => `0x${v.toString(16).toUpperCase().padStart(8, "0")}`;
  return render("stm32g031/selector-control.h.hbs", {
    controlText,
    debounceMs: SELECTOR_DEBOUNCE_MS,
    noContactRule: table.noContactRule,
    startIndex,
    tim: x.tim,
    ch: x.ch,
    psc: plan.divider - 1,
    mask: hex(pins.reduce((m, p) => m | (1 << p.bit), 0)),
    moderMask: hex(pins.reduce((m, p) => m | (3 << (2 * p.bit)), 0)),
    pupdrBits: hex(pins.reduce((m, p) => m | (1 << (2 * p.bit)), 0)),
    positions: table.positions.map((p, i) => ({
      position: p.position,
      bit: pins[i].bit,
      arr: p.periodCounts - 1,
      ccr: p.highCounts,
    })),
  });
}
