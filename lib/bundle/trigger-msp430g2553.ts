// Register view for triggered and zero-cross plans on the MSP430G2553 (engine.md
// section 6), rendered by templates/msp430g2553/trigger.c.hbs (handlers) and
// trigger-start.c.hbs (set-up). Timer0_A3 waits stopped at TAR = 0 in up mode
// set-up: TACCR1 = delayCounts (its CCIFG switches the output on), TACCR0 =
// delayCounts + highCounts (its CCIFG switches it off and stops the timer with
// TACLR). The port 1 handler starts the timer (MC_1); for both edges it flips
// P1IES after each edge. Facts: MSP430x2xx Family User's Guide (SLAU144):
// Digital I/O chapter (P1IES 0 = rising, 1 = falling; writing P1IES can set
// P1IFG, so the flag is cleared after the flip; P1IFG cleared in software;
// P1REN with P1OUT = 1 is a pull-up), Timer_A chapter (up mode counts to
// TACCR0; TACCRx CCIFG when TAR counts to TACCRx; TACCR0 CCIFG cleared when its
// interrupt is serviced; TACLR resets TAR and the divider), interrupt chapter
// (6 cycles to accept an interrupt). MSP430G2x53 datasheet (SLAS735):
// peripheral file map (P1IN 0x20 .. P1REN 0x27, TA0CTL 0x160, TA0CCTL0/1
// 0x162/0x164, TA0R 0x170, TA0CCR0/1 0x172/0x174) and interrupt vector table
// (PORT1 0xFFE4 = slot 2, TIMER0_A1 0xFFF0 = slot 8, TIMER0_A0 0xFFF2 = slot 9).
import { EngineError } from "@/lib/engine/errors";
import { msp430ClockSetup } from "./device-msp430g2553";
import { write, type RegisterWrite } from "./device-view";
import type { BundlePlan } from "./types";

/** clang interrupt slots (0xFFE0 + 2 * slot) the triggered firmware fills. */
export const MSP430_TRIGGER_SLOTS = [2, 8, 9] as const;

/**
 * SMCLK cycles from the TACCR0 match to the TACTL write that stops the timer
 * (trigger.c.hbs): up to 6 to finish the instruction in progress + 6 to accept
 * the interrupt + 4 (bic.b to P1OUT) + 5 (mov.w #imm to TA0CTL). Up mode has
 * already rolled TAR over to 0, so TACCR1 must lie beyond that or it would fire
 * again.
 */
export const MSP430_STOP_CYCLES = 6 + 6 + 4 + 5;

export interface Msp430TriggerView {
  outBit: number;
  outMask: string;
  inBit: number;
  inMask: string;
  ccr0: number;
  ccr1: number;
  ctlStop: string;
  ctlRun: string;
  ctlRestart: string;
  idName: string;
  rising: boolean;
  falling: boolean;
  both: boolean;
  restart: boolean;
  zeroCross: boolean;
  activeLow: boolean;
  onOp: "bis.b" | "bic.b";
  offOp: "bis.b" | "bic.b";
  edgeWords: string;
  /** Cycles of the P1OUT write: 4 with a constant-generator mask (1, 2, 4, 8), else 5 (family guide cycle table). */
  pinCycles: number;
  /** Timer0_A3 set-up writes in code order (trigger-start.c.hbs; the compare page's register table). */
  writes: RegisterWrite[];
}

const ID_BITS: Record<number, number> = { 1: 0, 2: 1, 4: 2, 8: 3 };
const hex4 = (v: number) => `0x${v.toString(16).toUpperCase().padStart(4, "0")}`;

function refuse(message: string, field = "timer"): never {
  throw new EngineError("invalid-request", `msp430g2553: ${message}`, field);
}

export function msp430g2553TriggerView(plan: BundlePlan): Msp430TriggerView | null {
  const start = plan.start;
  if (start === undefined || start === "free") return null;
  if (plan.delayCounts === undefined || plan.input === undefined)
    refuse("triggered plan without delayCounts or input", "start");
  const t = plan.timer.toUpperCase().replace(/[^A-Z0-9]/g, "");
  if (t !== "TIMER0A3" && t !== "TIMER0A" && t !== "TA0") refuse(`no triggered firmware for ${plan.timer}`);
  const clock = msp430ClockSetup(plan);
  // The latency is counted in CPU cycles at the plan's clock: MCLK and the timer's SMCLK must be the one DCO.
  if (clock.source !== "dco-cal")
    throw new EngineError(
      "invalid-request",
      `msp430g2553: triggered firmware runs from the calibrated DCO only (CPU and timer on one clock, so the stated latency holds); not from ${clock.label}`,
      "clockSource",
    );
  const id = ID_BITS[plan.divider];
  if (id === undefined) refuse(`input divider ${plan.divider}`);
  const out = /^P1\.([0-7])$/.exec(plan.pin.port);
  const inp = /^P1\.([0-7])$/.exec(plan.input.port);
  if (!out || !inp || out[1] === inp[1]) refuse(`pins ${plan.pin.port} / ${plan.input.port}`);
  const outBit = Number(out[1]);
  const inBit = Number(inp[1]);
  const ccr1 = plan.delayCounts;
  const ccr0 = plan.delayCounts + plan.highCounts;
  if (ccr0 > 65535)
    throw new EngineError(
      "unreachable-period",
      `msp430g2553: delay plus pulse ${ccr0} counts exceed TACCR0 (65535)`,
      "delayS",
    );
  if (ccr1 * plan.divider <= MSP430_STOP_CYCLES)
    throw new EngineError(
      "unreachable-period",
      `msp430g2553: a delay of ${ccr1 * plan.divider} cycles is shorter than the handler needs to stop the timer after the pulse (${MSP430_STOP_CYCLES + 1} cycles); ask for a longer delay.`,
      "delayS",
    );
  // TACTL: TASSEL_2 (SMCLK) bits 9..8 = 10, ID bits 7..6, MC bits 5..4, TACLR bit 2.
  const base = (2 << 8) | (id << 6);
  const edge = plan.edge ?? "rising";
  const activeLow = plan.activeLow === true;
  const idName = `ID_${id}`;
  const writes = [
    write(
      "TA0CTL",
      base | 0x04,
      `TASSEL_2 | ${idName} | MC_0 | TACLR`,
      `SMCLK/${plan.divider}, stopped at TAR = 0 until the input edge (the port 1 handler sets MC_1)`,
    ),
    write("TA0CCR1", ccr1, `${ccr1}u`, `pulse on at TAR = delayCounts = ${ccr1}`),
    write("TA0CCR0", ccr0, `${ccr0}u`, `pulse off and stop at TAR = delayCounts + highCounts = ${ccr0}`),
    write("TA0CCTL1", 0x10, "CCIE", "TACCR1 interrupt: pulse on"),
    write("TA0CCTL0", 0x10, "CCIE", "TACCR0 interrupt: pulse off, timer stopped"),
  ];
  return {
    outBit,
    outMask: `0x${(1 << outBit).toString(16).toUpperCase().padStart(2, "0")}`,
    inBit,
    inMask: `0x${(1 << inBit).toString(16).toUpperCase().padStart(2, "0")}`,
    ccr0,
    ccr1,
    ctlStop: hex4(base | 0x04),
    ctlRun: hex4(0x10),
    ctlRestart: hex4(base | 0x10 | 0x04),
    idName,
    rising: edge === "rising",
    falling: edge === "falling",
    both: edge === "both",
    restart: start === "trigger" && plan.retrigger === "restart",
    zeroCross: start === "zero-cross",
    activeLow,
    onOp: activeLow ? "bic.b" : "bis.b",
    offOp: activeLow ? "bis.b" : "bic.b",
    edgeWords: plan.edgeSetting ?? edge,
    pinCycles: [1, 2, 4, 8].includes(1 << outBit) ? 4 : 5,
    writes,
  };
}
