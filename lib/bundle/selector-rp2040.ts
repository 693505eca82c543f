// RP2040 firmware part that keeps the old stage's selector switch: one input
// per position on GPIO2..GPIO7 (pad pull-up, the switch's common contact to
// ground, so the selected position reads low), debounced on SysTick, and the
// engine's selector table (buildSelectorTable) as PWM TOP/CC per position.
// Rendered from templates/rp2040/selector-control.h.hbs. Facts: RP2040
// datasheet, PADS_BANK0 (IE, PUE, PDE, SCHMITT), IO_BANK0 (FUNCSEL 5 = SIO),
// SIO GPIO_IN, PWM (TOP and CC double buffered). QFN-56 package pins from memory.
import type { SelectorTable } from "@/lib/engine";
import { render } from "./render";
import {
  checkPositionCount,
  checkPositionCounts,
  inputMask,
  SELECTOR_DEBOUNCE_MS,
  selectorWiringLines,
  type WiringLine,
} from "./selector-common";

/** Input pins in position order: GPIO2..GPIO7 (QFN-56 pins 4..9; from memory). */
const RP2040_SELECTOR_PINS = [
  { gpio: 2, packagePin: 4 },
  { gpio: 3, packagePin: 5 },
  { gpio: 4, packagePin: 6 },
  { gpio: 5, packagePin: 7 },
  { gpio: 6, packagePin: 8 },
  { gpio: 7, packagePin: 9 },
] as const;

export function rp2040SelectorWiring(table: SelectorTable, valueText: (v: number) => string): WiringLine[] {
  const inputs = RP2040_SELECTOR_PINS.map((p) => ({ name: `GPIO${p.gpio}`, packagePin: p.packagePin }));
  return selectorWiringLines(table, valueText, inputs, "pad pull-up", {
    role: "switch common contact to ground",
    pin: "GND",
    packagePin: 57,
  });
}

export function renderRp2040Selector({
  table,
  startIndex,
  controlText,
}: {
  table: SelectorTable;
  startIndex: number;
  controlText: string;
}): string {
  const plan = table.plan;
  if (plan.device !== "rp2040" || plan.mode !== "pwm")
    throw new Error("The selector part runs on RP2040 edge-aligned PWM plans.");
  // a wide travel can make the table plan phase-correct (count up and down) on this clock: bad input, a 4xx
  if (plan.modeFactor !== 1)
    throw new Error(
      "targets: the longest position needs phase-correct PWM on this clock, and the RP2040 selector part runs edge-aligned PWM; choose a lower clock or closer values.",
    );
  const n = checkPositionCount(table, RP2040_SELECTOR_PINS.length, "the RP2040 part", "GPIO2..GPIO7");
  const gpio = plan.pin.gpio ?? Number(/\d+/.exec(plan.pin.port)?.[0]);
  const pins = RP2040_SELECTOR_PINS.slice(0, n);
  if (pins.some((p) => p.gpio === gpio)) throw new Error(`targets: GPIO${gpio} is a selector input.`);
  const div16 = Math.round(plan.divider * 16);
  if (Math.abs(div16 - plan.divider * 16) > 1e-9 || div16 < 16 || div16 > 4095)
    throw new Error(`divider ${plan.divider}: the PWM DIV register takes 1..255 in 1/16 steps.`);
  checkPositionCounts(table, 65536);
  return render("rp2040/selector-control.h.hbs", {
    controlText,
    debounceMs: SELECTOR_DEBOUNCE_MS,
    noContactRule: table.noContactRule,
    startIndex,
    slice: (gpio >> 1) & 7,
    channelB: (gpio & 1) === 1,
    divider: plan.divider,
    divInt: Math.floor(div16 / 16),
    divFrac: div16 % 16,
    mask: inputMask(
      pins.map((p) => p.gpio),
      1,
    ),
    positions: table.positions.map((p, i) => ({
      position: p.position,
      gpio: pins[i].gpio,
      top: p.periodCounts - 1,
      compare: p.highCounts,
    })),
  });
}
