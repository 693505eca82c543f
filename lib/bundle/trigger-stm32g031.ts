// Register view for triggered and zero-cross plans on the STM32G031 (engine.md
// section 6), rendered by templates/stm32g031/trigger.c.hbs. The plan's timer
// runs in one-pulse mode (CR1.OPM) with channel 1 in PWM mode 2 on its own pin
// (alternate function): the output is inactive while CNT < CCR1 and active
// from CCR1 to ARR, and the update at the end of the run clears CEN by
// itself. CCR1 = delayCounts, ARR = delayCounts + highCounts - 1. The EXTI
// handler only sets CEN (restart rule: UG first, which puts the count and the
// prescaler back to 0). Facts: RM0444 (STM32G0x1 reference manual): EXTI
// chapter (EXTI_RTSR1, EXTI_FTSR1, EXTI_RPR1 / EXTI_FPR1 write 1 to clear,
// EXTI_EXTICR1 EXTI1 field bits 15:8, 0 = port A, EXTI_IMR1), interrupt
// vectors (EXTI0_1 = IRQ 5), general-purpose timers (CR1 OPM bit 3, CEN
// bit 0; CCMR1 OC1M = 111 PWM mode 2; CCER CC1E bit 0, CC1P bit 1; EGR UG).
import { EngineError } from "@/lib/engine/errors";
import type { BundlePlan } from "./types";

export interface Stm32TriggerView {
  tim: "TIM2" | "TIM3";
  timBase: string;
  apbBit: number;
  af: number;
  afr: number;
  afShift: number;
  outBit: number;
  psc: number;
  arr: number;
  ccr1: number;
  ccer: number;
  inBit: number;
  extiLine: number;
  exticrShift: number;
  irq: number;
  rising: boolean;
  falling: boolean;
  edgeWords: string;
  delayCounts: number;
  offCount: number;
  restart: boolean;
  zeroCross: boolean;
  activeLow: boolean;
}

const TIMS = {
  TIM2: { base: 0x40000000, apbBit: 0, af: 2, max: 2 ** 32 },
  TIM3: { base: 0x40000400, apbBit: 1, af: 1, max: 65536 },
};

export function stm32g031TriggerView(plan: BundlePlan): Stm32TriggerView | null {
  const start = plan.start;
  if (start === undefined || start === "free") return null;
  if (plan.delayCounts === undefined || plan.input === undefined)
    throw new EngineError(
      "invalid-request",
      "stm32g031: triggered plan without delayCounts or input",
      "start",
    );
  const tim = plan.timer.toUpperCase();
  if (tim !== "TIM2" && tim !== "TIM3")
    throw new EngineError("unknown-timer", `stm32g031: no triggered firmware for ${plan.timer}`, "timer");
  const t = TIMS[tim];
  const out = /^PA(\d+)$/.exec(plan.pin.port);
  const inp = /^PA(\d+)$/.exec(plan.input.port);
  if (!out || !inp)
    throw new EngineError(
      "invalid-request",
      `stm32g031: pins ${plan.pin.port} / ${plan.input.port}`,
      "timer",
    );
  const outBit = Number(out[1]);
  const inBit = Number(inp[1]);
  const offCount = plan.delayCounts + plan.highCounts;
  if (offCount > t.max)
    throw new EngineError(
      "unreachable-period",
      `stm32g031 ${tim}: delay plus pulse ${offCount} counts exceed the counter (${t.max})`,
      "delayS",
    );
  if (!Number.isInteger(plan.divider) || plan.divider < 1 || plan.divider > 65536)
    throw new EngineError("invalid-request", `stm32g031 ${tim}: prescaler ${plan.divider}`, "timer");
  const edge = plan.edge ?? "rising";
  const activeLow = plan.activeLow === true;
  // EXTI line n sits in EXTICR(n / 4 + 1), field 8 * (n % 4); IRQ 5 for lines 0-1, 6 for 2-3, 7 for 4-15.
  if (inBit > 3)
    throw new EngineError("invalid-request", `stm32g031: input ${plan.input.port} (EXTI ${inBit})`, "timer");
  return {
    tim,
    timBase: `0x${t.base.toString(16).toUpperCase()}u`,
    apbBit: t.apbBit,
    af: plan.pin.alternateFunction ?? t.af,
    afr: outBit < 8 ? 0 : 1,
    afShift: 4 * (outBit % 8),
    outBit,
    psc: plan.divider - 1,
    arr: offCount - 1,
    ccr1: plan.delayCounts,
    ccer: activeLow ? 0b11 : 0b01,
    inBit,
    extiLine: inBit,
    exticrShift: 8 * (inBit % 4),
    irq: inBit < 2 ? 5 : 6,
    rising: edge !== "falling",
    falling: edge !== "rising",
    edgeWords: plan.edgeSetting ?? edge,
    delayCounts: plan.delayCounts,
    offCount,
    restart: start === "trigger" && plan.retrigger === "restart",
    zeroCross: start === "zero-cross",
    activeLow,
  };
}
