// MSP430G2553 firmware part that keeps the old stage's selector switch: one
// input per position on P2.0..P2.5 (P2REN pull-up, the switch's common contact
// to ground, so the selected position reads low), debounced with a counted
// delay loop, and the engine's selector table as TA0CCR0/TA0CCR1 per position.
// Rendered from templates/msp430g2553/selector-control.h.hbs. Facts: SLAU144
// Digital I/O (PxREN with PxOUT selects pull-up or pull-down) and Timer_A (up
// mode, ID). PDIP-20 package pins of P2.0..P2.5 (8..13) from memory.
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
import type { BundlePlan } from "./types";

/** Input pins in position order: P2.0..P2.5 (PDIP-20 pins 8..13; from memory). */
const MSP430_SELECTOR_PINS = [0, 1, 2, 3, 4, 5].map((bit) => ({ bit, packagePin: 8 + bit }));
const ID: Record<number, string> = { 1: "ID_0", 2: "ID_1", 4: "ID_2", 8: "ID_3" };
/** MCLK when the timer runs from ACLK: the DCO's reset setting, about 1.1 MHz (MSP430G2x53 datasheet; from memory). */
const DEFAULT_DCO_HZ = 1.1e6;

export function msp430g2553SelectorWiring(
  table: SelectorTable,
  valueText: (v: number) => string,
): WiringLine[] {
  const inputs = MSP430_SELECTOR_PINS.map((p) => ({ name: `P2.${p.bit}`, packagePin: p.packagePin }));
  return selectorWiringLines(table, valueText, inputs, "internal pull-up (P2REN)", {
    role: "switch common contact to ground",
    pin: "DVSS",
    packagePin: 20,
  });
}

export function renderMsp430g2553Selector({
  table,
  startIndex,
  controlText,
}: {
  table: SelectorTable;
  startIndex: number;
  controlText: string;
}): string {
  const plan = table.plan as unknown as BundlePlan;
  if (plan.device !== "msp430g2553" || plan.mode !== "pwm" || plan.modeFactor !== 1)
    throw new Error("The selector part runs on MSP430G2553 Timer0_A3 PWM plans.");
  const n = checkPositionCount(table, MSP430_SELECTOR_PINS.length, "the MSP430G2553 part", "P2.0..P2.5");
  const idName = ID[plan.divider];
  if (!idName) throw new Error(`divider ${plan.divider} is not a Timer_A input divider.`);
  checkPositionCounts(table, 65536);
  const source = plan.clockSource ?? "dco-cal";
  const mclkHz = source === "dco-cal" ? plan.clockHz : DEFAULT_DCO_HZ;
  const pins = MSP430_SELECTOR_PINS.slice(0, n);
  return render("msp430g2553/selector-control.h.hbs", {
    controlText,
    debounceMs: SELECTOR_DEBOUNCE_MS,
    noContactRule: table.noContactRule,
    startIndex,
    divider: plan.divider,
    idName,
    mclkHz,
    loopsPerMs: Math.max(1, Math.round(mclkHz / 1000 / 3)),
    mask: inputMask(
      pins.map((p) => p.bit),
      2,
    ),
    positions: table.positions.map((p, i) => ({
      position: p.position,
      bit: pins[i].bit,
      ccr0: p.periodCounts - 1,
      ccr1: p.highCounts,
    })),
  });
}
