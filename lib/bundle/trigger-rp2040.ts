// Register view for triggered and zero-cross plans on the RP2040 (engine.md
// section 6), rendered by templates/rp2040/trigger.c.hbs. The plan's PWM
// slice drives the output pin itself (FUNCSEL 4) with A_INV set, so the pin
// is low while counter < CC and high from CC to TOP: CC = delayCounts,
// TOP = delayCounts + highCounts - 1 gives the pulse from the delay to the
// wrap. The slice is stopped with its counter at 0 between runs; the GPIO
// edge interrupt (IO_IRQ_BANK0) sets CSR.EN, the wrap interrupt clears it.
// Facts: RP2040 datasheet, 4.5 PWM (CSR EN/A_INV, DIV, CTR, CC, TOP, INTR,
// INTE; IRQ 4 PWM_IRQ_WRAP), 2.19 GPIO (IO_BANK0 INTR0..3 and PROC0_INTE0..3,
// four bits per GPIO: LEVEL_LOW, LEVEL_HIGH, EDGE_LOW, EDGE_HIGH; edge bits
// are cleared by writing 1; IRQ 13 IO_IRQ_BANK0; PADS_BANK0 IE/PUE/SCHMITT),
// 2.1.2 atomic register access (+0x2000 set, +0x3000 clear aliases).
import { EngineError } from "@/lib/engine/errors";
import type { BundlePlan } from "./types";

export interface Rp2040TriggerView {
  outGpio: number;
  slice: number;
  /** CSR offset of the slice, and its atomic set/clear alias addresses */
  csrSet: string;
  csrClr: string;
  ctr: string;
  divInt: number;
  top: number;
  cc: number;
  /** A_INV (bit 2) for an active-high pulse: the slice's A output is high while counter >= CC. */
  csrValue: number;
  inGpio: number;
  /** INTRn / PROC0_INTEn register index and the edge bits of the input GPIO in it */
  intReg: number;
  edgeMask: string;
  intrAddr: string;
  inteSet: string;
  inteClr: string;
  edgeWords: string;
  delayCounts: number;
  offCount: number;
  restart: boolean;
  zeroCross: boolean;
  activeLow: boolean;
}

const hex = (n: number) => `0x${(n >>> 0).toString(16).toUpperCase().padStart(8, "0")}u`;

const PWM_BASE = 0x40050000;
const IO_BANK0_BASE = 0x40014000;
const SET = 0x2000;
const CLR = 0x3000;
/** Cycles the wrap handler needs before the counter is stopped; a delay shorter than this would fire twice. */
export const RP2040_WRAP_STOP_CYCLES = 64;

export function rp2040TriggerView(plan: BundlePlan): Rp2040TriggerView | null {
  const start = plan.start;
  if (start === undefined || start === "free") return null;
  if (plan.delayCounts === undefined || plan.input === undefined)
    throw new EngineError("invalid-request", "rp2040: triggered plan without delayCounts or input", "start");
  const outGpio = plan.pin.gpio ?? Number(/^GPIO(\d+)$/.exec(plan.pin.port)?.[1]);
  const inGpio = plan.input.gpio ?? Number(/^GPIO(\d+)$/.exec(plan.input.port)?.[1]);
  if (!Number.isInteger(outGpio) || !Number.isInteger(inGpio))
    throw new EngineError("invalid-request", `rp2040: pins ${plan.pin.port} / ${plan.input.port}`, "timer");
  const slice = (outGpio >> 1) & 7;
  if ((outGpio & 1) !== 0 || `PWM${slice}` !== plan.timer.toUpperCase())
    throw new EngineError(
      "invalid-request",
      `rp2040: ${plan.pin.port} is not channel A of ${plan.timer}`,
      "timer",
    );
  if (!Number.isInteger(plan.divider) || plan.divider < 1 || plan.divider > 255)
    throw new EngineError("invalid-request", `rp2040 ${plan.timer}: divider ${plan.divider}`, "timer");
  const offCount = plan.delayCounts + plan.highCounts;
  if (offCount > 65536)
    throw new EngineError(
      "unreachable-period",
      `rp2040 ${plan.timer}: delay plus pulse ${offCount} counts exceed the counter (65536)`,
      "delayS",
    );
  if (plan.delayCounts * plan.divider < RP2040_WRAP_STOP_CYCLES)
    throw new EngineError(
      "invalid-request",
      `rp2040: a delay of ${plan.delayCounts * plan.divider} clock cycles is shorter than the ${RP2040_WRAP_STOP_CYCLES} the firmware needs to stop the slice after a pulse; ask for a longer delay (delayS).`,
      "delayS",
    );
  const csr = PWM_BASE + 0x14 * slice;
  const intReg = inGpio >> 3;
  const shift = 4 * (inGpio & 7);
  const edge = plan.edge ?? "rising";
  const bits = edge === "rising" ? 0b1000 : edge === "falling" ? 0b0100 : 0b1100;
  const activeLow = plan.activeLow === true;
  return {
    outGpio,
    slice,
    csrSet: hex(csr + SET),
    csrClr: hex(csr + CLR),
    ctr: hex(csr + 0x08),
    divInt: plan.divider,
    top: offCount - 1,
    cc: plan.delayCounts,
    csrValue: activeLow ? 0 : 1 << 2,
    inGpio,
    intReg,
    edgeMask: hex(bits << shift),
    intrAddr: hex(IO_BANK0_BASE + 0xf0 + 4 * intReg),
    inteSet: hex(IO_BANK0_BASE + 0x100 + 4 * intReg + SET),
    inteClr: hex(IO_BANK0_BASE + 0x100 + 4 * intReg + CLR),
    edgeWords: plan.edgeSetting ?? edge,
    delayCounts: plan.delayCounts,
    offCount,
    restart: start === "trigger" && plan.retrigger === "restart",
    zeroCross: start === "zero-cross",
    activeLow,
  };
}
