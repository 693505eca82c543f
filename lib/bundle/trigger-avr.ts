// Register view for triggered and zero-cross plans on the two AVRs (engine.md
// section 6), rendered by templates/<avr>/trigger.c.hbs. The timer is stopped
// with its count at 0; the INT0 handler starts it; compare A puts the output
// pulse on, compare B takes it off and stops the timer again. Facts:
// ATmega328P datasheet DS40002061: External Interrupts (EICRA ISC01:0, EIMSK,
// EIFR), Timer/Counter1 (TCCR1B CS12:10, OCR1A/B, TIMSK1 OCIE1A/B, TIFR1),
// Timer/Counter0 and 2 (TCCRxB CSx2:0, OCRxA/B, TIMSKx, TIFRx).
// ATtiny25/45/85 datasheet: External Interrupts (MCUCR ISC01:0, GIMSK INT0,
// GIFR INTF0), Timer/Counter0 (TCCR0B CS02:0), Timer/Counter1 (TCCR1 CS13:10,
// CK/2^(CS-1)), TIMSK and TIFR shared by both timers.
import { EngineError } from "@/lib/engine/errors";
import type { BundlePlan } from "./types";

export interface AvrTriggerView {
  /** Timer control register holding the clock-select bits (writing 0 stops it). */
  ctrl: string;
  csValue: number;
  /** Other control register of the timer, written 0 (normal counting, pins not driven by the timer). */
  ctrlOther: string;
  ocrA: string;
  ocrB: string;
  delayCounts: number;
  offCount: number;
  /** Count registers, high byte first for the 16-bit Timer1 (datasheet: 16-bit access). */
  tcnt: string[];
  timsk: string;
  timskBits: string;
  tifr: string;
  tifrBits: string;
  vecA: string;
  vecB: string;
  edgeReg: string;
  edgeBits: string;
  edgeValue: number;
  edgeWords: string;
  intMask: string;
  intFlag: string;
  inPort: string;
  inBit: number;
  outPort: string;
  outBit: number;
  /** sbi/cbi that put the pulse on and take it off (active-low swaps them). */
  on: "sbi" | "cbi";
  off: "sbi" | "cbi";
  idleHigh: boolean;
  restart: boolean;
  zeroCross: boolean;
}

const CS01: Record<number, number> = { 1: 1, 8: 2, 64: 3, 256: 4, 1024: 5 };
const CS2: Record<number, number> = { 1: 1, 8: 2, 32: 3, 64: 4, 128: 5, 256: 6, 1024: 7 };
const ISC: Record<string, number> = { both: 1, falling: 2, rising: 3 };

function csOf(table: Record<number, number>, plan: BundlePlan): number {
  const v = table[plan.divider];
  if (v === undefined)
    throw new EngineError(
      "invalid-request",
      `${plan.device} ${plan.timer}: no prescaler ${plan.divider}`,
      "timer",
    );
  return v;
}

/** ATtiny85 Timer1 clock select: CK/2^(CS13:10 - 1), 1 to 16384. */
function tiny85Timer1Cs(plan: BundlePlan): number {
  const cs = Math.log2(plan.divider) + 1;
  if (!Number.isInteger(cs) || cs < 1 || cs > 15)
    throw new EngineError("invalid-request", `attiny85 TIMER1: no prescaler ${plan.divider}`, "timer");
  return cs;
}

/** The view, or null for a free-running plan. Throws for a device without triggered firmware. */
export function avrTriggerView(plan: BundlePlan): AvrTriggerView | null {
  const start = plan.start;
  if (start === undefined || start === "free") return null;
  if (plan.delayCounts === undefined || plan.input === undefined)
    throw new EngineError(
      "invalid-request",
      `${plan.device}: triggered plan without delayCounts or input`,
      "start",
    );
  const t = plan.timer.toUpperCase();
  const n = t === "TIMER1" ? "1" : t === "TIMER0" ? "0" : t === "TIMER2" ? "2" : null;
  if (n === null) throw new EngineError("unknown-timer", `${plan.device}: no timer ${plan.timer}`, "timer");
  const tiny = plan.device === "attiny85";
  const wide = !tiny && n === "1";
  const offCount = plan.delayCounts + plan.highCounts;
  const max = wide ? 65535 : 255;
  if (offCount > max)
    throw new EngineError(
      "unreachable-period",
      `${plan.device} ${plan.timer}: delay plus pulse ${offCount} counts exceed the counter (${max})`,
      "delayS",
    );
  const edge = plan.edge ?? "rising";
  const outPort = plan.pin.port;
  const inPort = plan.input.port;
  const activeLow = plan.activeLow === true;
  const tinyT1 = tiny && n === "1";
  return {
    ctrl: tinyT1 ? "TCCR1" : `TCCR${n}B`,
    csValue: tinyT1 ? tiny85Timer1Cs(plan) : csOf(!tiny && n === "2" ? CS2 : CS01, plan),
    ctrlOther: tinyT1 ? "GTCCR" : `TCCR${n}A`,
    ocrA: `OCR${n}A`,
    ocrB: `OCR${n}B`,
    delayCounts: plan.delayCounts,
    offCount,
    tcnt: wide ? ["TCNT1H", "TCNT1L"] : [`TCNT${n}`],
    timsk: tiny ? "TIMSK" : `TIMSK${n}`,
    timskBits: `(1 << OCIE${n}A) | (1 << OCIE${n}B)`,
    tifr: tiny ? "TIFR" : `TIFR${n}`,
    tifrBits: `(1 << OCF${n}A) | (1 << OCF${n}B)`,
    vecA: `TIMER${n}_COMPA_vect`,
    vecB: `TIMER${n}_COMPB_vect`,
    edgeReg: tiny ? "MCUCR" : "EICRA",
    edgeBits:
      ISC[edge] === 3 ? "(1 << ISC01) | (1 << ISC00)" : ISC[edge] === 2 ? "(1 << ISC01)" : "(1 << ISC00)",
    edgeValue: ISC[edge],
    edgeWords: plan.edgeSetting ?? edge,
    intMask: tiny ? "GIMSK" : "EIMSK",
    intFlag: tiny ? "GIFR" : "EIFR",
    inPort: inPort.charAt(1),
    inBit: Number(inPort.slice(2)),
    outPort: outPort.charAt(1),
    outBit: Number(outPort.slice(2)),
    on: activeLow ? "cbi" : "sbi",
    off: activeLow ? "sbi" : "cbi",
    idleHigh: activeLow,
    restart: start === "trigger" && plan.retrigger === "restart",
    zeroCross: start === "zero-cross",
  };
}
