// Triggered and zero-cross firmware on the STM32G031 (engine.md section 6),
// checked in the python3-unicorn harness (lib/firmware/emulate/harness/stm32g031-emu.py). The
// harness has no counting timer and no pin timing, so this is proof by
// registers and by the interrupt path: the image runs from reset to its idle
// loop, then the harness raises the EXTI line as the EXTI would (pending only
// for a selected edge, handler only when unmasked) and calls the handler
// through the vector table VTOR points to. Checked against RM0444 (STM32G0x1
// reference manual): EXTI chapter (RTSR1, FTSR1, RPR1/FPR1, EXTICR1 EXTI1
// field bits 15:8 = 0 for port A, IMR1), interrupt vectors (EXTI0_1 = IRQ 5),
// general-purpose timer chapter (one-pulse mode: CR1.OPM bit 3, the update
// clears CEN; PWM mode 2, OC1M = 111: inactive while CNT < CCR1; CCER CC1E;
// counter clock f/(PSC+1); EGR.UG reinitialises the counter), GPIO chapter
// (MODER 10 alternate function, 00 input; PUPDR 01 pull-up; AFRL), and the
// STM32G031 alternate function table (TIM2_CH1 on PA0 = AF2). Handler cycles
// from the ARMv6-M cycle table (the harness counts the executed opcodes).
// What follows from these registers: delay = CCR1*(PSC+1) clocks after CEN,
// pulse = (ARR+1-CCR1)*(PSC+1) clocks, each within one count of the request.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import { planTarget, type TimerPlan } from "@/lib/engine";
import { TRIGGER_INPUTS } from "@/lib/engine/solver/trigger-inputs";
import { buildStm32, runStm32, type Stm32Run } from "../../tools/stm32g031-emu";

type Target = BundleTargetRequest & Record<string, unknown>;
type Edge = "rising" | "falling";

const EXTI_IRQ = 5; // RM0444 vector table: EXTI0_1
const LINE = 1; // PA1 = EXTI1

function build(target: Target, edit?: (c: string) => string) {
  const files = buildBundleSources({
    retrofit: { name: "Trigger proof" },
    revision: 1,
    stage: { kind: "timer555-monostable", r: 10e3, c: 1e-6 },
    targets: [target],
  });
  const plan = planTarget(target as never) as TimerPlan;
  return { plan, elf: buildStm32(files, "stm32g031", edit).elf };
}

/** Problems with the set-up after reset, judged against the plan and RM0444. */
function setupProblems(run: Stm32Run, plan: TimerPlan, target: Target): string[] {
  const p: string[] = [];
  if (!run.idle) p.push(`never reached the idle loop: ${run.error ?? JSON.stringify(run.stuck)}`);
  p.push(...run.faults);
  const t = run.timers[plan.timer as "TIM2" | "TIM3"];
  const n = t.PSC + 1;
  if (n !== plan.divider) p.push(`PSC+1 = ${n}, plan divider ${plan.divider}`);
  const f = plan.clockHz;
  const delayS = (t.CCR1 * n) / f;
  const pulseS = ((t.ARR + 1 - t.CCR1) * n) / f;
  const countS = n / f;
  if (Math.abs(delayS - (target.delayS as number)) > countS) p.push(`delay ${delayS} s from CCR1 ${t.CCR1}`);
  if (Math.abs(pulseS - target.highS) > countS) p.push(`pulse ${pulseS} s from ARR ${t.ARR}, CCR1 ${t.CCR1}`);
  if (((t.CCMR1 >> 4) & 7) !== 7) p.push(`CCMR1 OC1M ${(t.CCMR1 >> 4) & 7}, not PWM mode 2`);
  if ((t.CCER & 1) !== 1) p.push("CCER CC1E off");
  if (t.CR1 !== 1 << 3) p.push(`CR1 ${t.CR1}: want OPM set and CEN clear before the first edge`);
  const a = run.gpio.A;
  if (((a.MODER >> 0) & 3) !== 2 || (a.AFRL & 15) !== 2) p.push("PA0 is not AF2 (TIM2_CH1)");
  if (((a.MODER >> 2) & 3) !== 0 || ((a.PUPDR >> 2) & 3) !== 1) p.push("PA1 is not an input with pull-up");
  const e = run.exti!;
  const edge = (target.edge as string | undefined) ?? "rising";
  if (!!(e.RTSR1 & 2) !== (edge !== "falling"))
    p.push(`EXTI_RTSR1 bit 1 = ${e.RTSR1 & 2 ? 1 : 0} for ${edge}`);
  if (!!(e.FTSR1 & 2) !== (edge !== "rising"))
    p.push(`EXTI_FTSR1 bit 1 = ${e.FTSR1 & 2 ? 1 : 0} for ${edge}`);
  if (((e.EXTICR1 >> 8) & 0xff) !== 0) p.push("EXTICR1 EXTI1 is not port A");
  if (!(e.IMR1 & 2)) p.push("EXTI_IMR1 bit 1 off");
  if (!(run.nvicIser & (1 << EXTI_IRQ))) p.push("NVIC EXTI0_1 off");
  if (run.vtor === undefined || run.vtor < 0x20000000) p.push("vector table not moved to SRAM");
  return p;
}

function edges(elf: string, list: Edge[]) {
  return runStm32(elf, { extiIrq: EXTI_IRQ, extiLine: LINE, edges: list });
}

/** Cycles from handler entry to the end of the store that writes `reg` (store = 2 cycles). */
function cyclesTo(call: NonNullable<Stm32Run["edgeCalls"]>[number], reg: string): number {
  const w = call.writes?.find((x) => x[0] === reg);
  return w ? w[2] + 2 : NaN;
}

const HANDLER_BUDGET = TRIGGER_INPUTS.stm32g031.handlerCycles;

describe("STM32G031 triggered firmware in the unicorn harness", () => {
  it.each([50, 60])("zero-cross at %i Hz, both edges: every crossing starts the one-pulse run", (hz) => {
    const halfS = 1 / (2 * hz);
    const target: Target = {
      device: "stm32g031",
      clockHz: 16e6,
      periodS: halfS,
      highS: 100e-6,
      start: "zero-cross",
      delayS: 0.3 * halfS,
      edge: "both",
    };
    const { plan, elf } = build(target);
    expect(setupProblems(edges(elf, []), plan, target)).toEqual([]);
    const run = edges(elf, ["rising", "falling"]);
    for (const c of run.edgeCalls!) {
      expect(c.called).toBe(true);
      expect(c.handler! & ~1).toBeGreaterThanOrEqual(0x20000000); // handler in SRAM
      expect(c.pendingAfter).toBe(false);
      expect(c.timers.TIM2.CR1 & 1).toBe(1);
      expect(cyclesTo(c, "TIM2_CR1")).toBeLessThanOrEqual(HANDLER_BUDGET);
      expect(c.cycles).toBeGreaterThan(0); // every opcode known to the cycle table
    }
  });

  const trig = (retrigger: "ignore" | "restart", edge: Edge): Target => ({
    device: "stm32g031",
    clockHz: 16e6,
    periodS: 0.02,
    highS: 0.001,
    start: "trigger",
    delayS: 0.004,
    edge,
    retrigger,
  });

  it("trigger on rising edges, ignore rule: a falling edge calls nothing, a second rise leaves the run alone", () => {
    const target = trig("ignore", "rising");
    const { plan, elf } = build(target);
    expect(setupProblems(edges(elf, []), plan, target)).toEqual([]);
    const [fall, rise, again] = edges(elf, ["falling", "rising", "rising"]).edgeCalls!;
    expect(fall.called).toBe(false);
    expect(rise.called).toBe(true);
    expect(cyclesTo(rise, "TIM2_CR1")).toBeLessThanOrEqual(HANDLER_BUDGET);
    expect(again.writes!.some((w) => w[0] === "TIM2_EGR")).toBe(false);
    expect(again.timers.TIM2.CR1 & 1).toBe(1);
  });

  it("trigger on falling edges, restart rule: UG puts the count back to 0 before CEN", () => {
    const target = trig("restart", "falling");
    const { plan, elf } = build(target);
    expect(setupProblems(edges(elf, []), plan, target)).toEqual([]);
    const [first, again] = edges(elf, ["falling", "falling"]).edgeCalls!;
    for (const c of [first, again]) {
      expect(c.called).toBe(true);
      const order = c.writes!.map((w) => w[0]);
      expect(order.indexOf("TIM2_EGR")).toBeLessThan(order.indexOf("TIM2_CR1"));
      expect(cyclesTo(c, "TIM2_CR1")).toBeLessThanOrEqual(HANDLER_BUDGET);
      expect(c.timers.TIM2.CR1 & 1).toBe(1);
      expect(c.timers.TIM2.CNT).toBe(0);
    }
  });

  // Planted faults: the harness must catch each one.
  it("catches a wrong edge (FTSR1 instead of RTSR1)", () => {
    const target = trig("ignore", "rising");
    const { plan, elf } = build(target, (c) => c.replace("EXTI_RTSR1 |=", "EXTI_FTSR1 |="));
    expect(setupProblems(edges(elf, []), plan, target).length).toBeGreaterThan(0);
    expect(edges(elf, ["rising"]).edgeCalls![0].called).toBe(false);
  });

  it("catches a delay two counts long (CCR1 + 2)", () => {
    const target = trig("ignore", "rising");
    const good = build(target);
    const ccr = good.plan.delayCounts!;
    const { plan, elf } = build(target, (c) => c.replace(`->CCR1 = ${ccr}u;`, `->CCR1 = ${ccr + 2}u;`));
    expect(setupProblems(edges(good.elf, []), good.plan, target)).toEqual([]);
    expect(setupProblems(edges(elf, []), plan, target).length).toBeGreaterThan(0);
  });
});
