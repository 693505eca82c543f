// Register view for triggered and zero-cross plans on the PIC12F1840 (engine.md
// section 6), rendered by templates/pic12f1840/trigger.asm.hbs (the image) and
// trigger.c.hbs (the C twin). Timer2 is stopped at 0 with PR2 = delayCounts - 1;
// the input's interrupt-on-change sets TMR2ON. The match (TMR2IF, after
// delayCounts counts; TMR2 is back at 0) switches the output on and loads
// PR2 = highCounts - 1; the next match switches it off, stops Timer2 and loads
// the delay again. Facts: PIC12(L)F1840 datasheet (DS40001441): interrupt-on-
// change chapter (IOCAP/IOCAN select rising/falling per pin, both set = both
// edges; IOCAF flags, cleared in software; INTCON IOCIE bit 3), Timer2 chapter
// (TMR2 counts to PR2 and resets to 0 on the next increment, setting TMR2IF;
// a write to TMR2 or T2CON clears the prescaler; T2CKPS 1:1/1:4/1:16/1:64),
// OPTION_REG nWPUEN bit 7 and WPUA (weak pull-ups), INTCON GIE 7, PEIE 6.
import { EngineError } from "@/lib/engine/errors";
import { write } from "./device-view";
import {
  hex2,
  picConfig,
  picOscSteps,
  picOsccon,
  step,
  type PicConfig,
  type PicStep,
} from "./device-pic12f1840";
import type { BundlePlan } from "./types";

const T2CKPS: Record<number, number> = { 1: 0, 4: 1, 16: 2, 64: 3 };

/**
 * Instruction cycles from the Timer2 match to the PR2 write of the pulse in the
 * generated handler (templates/pic12f1840/trigger.asm.hbs): response up to 4
 * (synchronous interrupt, datasheet interrupt latency, from memory) + 13 for
 * banksel 1, btfss 1, goto 2, banksel 1, btfsc (skip) 2, movlw 1, nop 1,
 * movwf 1, banksel 1, movlw 1, movwf 1. TMR2 has counted from 0 meanwhile, so
 * PR2 = highCounts - 1 must still be ahead of it.
 */
export const PIC_PR2_WRITE_CYCLES = 4 + 13;

export interface PicTriggerView {
  config: PicConfig;
  steps: PicStep[];
  outBit: number;
  inBit: number;
  onLevel: string;
  offLevel: string;
  prDelay: number;
  prHigh: number;
  prescale: number;
  t2con: string;
  iocap: string;
  iocan: string;
  restart: boolean;
  zeroCross: boolean;
  edgeWords: string;
  activeLow: boolean;
}

function refuse(message: string, field = "timer"): never {
  throw new EngineError("invalid-request", `pic12f1840: ${message}`, field);
}

export function pic12f1840TriggerView(plan: BundlePlan): PicTriggerView | null {
  const start = plan.start;
  if (start === undefined || start === "free") return null;
  if (plan.delayCounts === undefined || plan.input === undefined)
    refuse("triggered plan without delayCounts or input", "start");
  if (plan.timer.toUpperCase() !== "TIMER2") refuse(`no triggered firmware for ${plan.timer}`);
  const prescale = plan.divider / 4;
  const ckps = T2CKPS[prescale];
  if (ckps === undefined) refuse(`Timer2 prescale ${prescale} (divider ${plan.divider})`);
  const out = /^RA([0-5])$/.exec(plan.pin.port);
  const inp = /^RA([0-5])$/.exec(plan.input.port);
  if (!out || !inp) refuse(`pins ${plan.pin.port} / ${plan.input.port}`);
  const outBit = Number(out[1]);
  const inBit = Number(inp[1]);
  if (outBit === inBit || outBit === 3) refuse(`output ${plan.pin.port} with input ${plan.input.port}`);
  // PR2 holds one phase at a time: each phase at most 256 counts.
  if (plan.delayCounts < 1 || plan.delayCounts > 256 || plan.highCounts < 1 || plan.highCounts > 256)
    refuse(`delay ${plan.delayCounts} / pulse ${plan.highCounts} counts outside PR2's 1..256`, "delayS");
  if ((plan.highCounts - 1) * prescale <= PIC_PR2_WRITE_CYCLES + 1)
    throw new EngineError(
      "unreachable-period",
      `pic12f1840: a pulse of ${plan.highCounts} Timer2 counts (${plan.highCounts * prescale} instruction cycles) is shorter than the handler needs to load it (${PIC_PR2_WRITE_CYCLES + 2} cycles); ask for a longer pulse or a lower clock.`,
      "highS",
    );
  const config = picConfig(plan);
  const osc = config.fosc === "INTOSC" ? picOsccon(plan.clockHz) : null;
  if (config.fosc === "INTOSC" && !osc)
    refuse(`the internal oscillator has no IRCF step at ${plan.clockHz} Hz`);
  const crystal = config.fosc === "LP" || config.fosc === "XT" || config.fosc === "HS";
  if (config.fosc !== "INTOSC" && (outBit === 5 || inBit === 5)) refuse("RA5 carries OSC1/CLKIN");
  if (crystal && (outBit === 4 || inBit === 4)) refuse("RA4 carries OSC2");
  const edge = plan.edge ?? "rising";
  const activeLow = plan.activeLow === true;
  const outMask = 1 << outBit;
  const inMask = 1 << inBit;
  const onLevel = hex2(activeLow ? 0 : outMask);
  const offLevel = hex2(activeLow ? outMask : 0);
  const iocap = hex2(edge !== "falling" ? inMask : 0);
  const iocan = hex2(edge !== "rising" ? inMask : 0);
  const t2con = hex2(ckps);
  const steps: PicStep[] = picOscSteps(config, osc);
  const put = (w: ReturnType<typeof write>) => steps.push(step({ bankOf: w.reg, write: w }));
  put(write("ANSELA", 0, "0x00", "all of PORTA digital"));
  put(write("LATA", activeLow ? outMask : 0, offLevel, "output latch at the pulse's off level"));
  put(
    write(
      "TRISA",
      0x3f & ~outMask,
      hex2(0x3f & ~outMask),
      `${plan.pin.port} output (GPIO), ${plan.input.port} and the rest inputs`,
    ),
  );
  put(write("OPTION_REG", 0x7f, "0x7F", "nWPUEN = 0: weak pull-ups as WPUA selects"));
  put(write("WPUA", inMask, hex2(inMask), `weak pull-up on ${plan.input.port} only`));
  put(write("T2CON", ckps, t2con, `TMR2ON = 0 (stopped), T2CKPS = ${ckps} (prescale 1:${prescale})`));
  put(write("TMR2", 0, "0x00", "count from 0 at the first edge"));
  const prDelay = plan.delayCounts - 1;
  const prHigh = plan.highCounts - 1;
  put(write("PR2", prDelay, String(prDelay), `PR2 = delayCounts - 1: the first match ends the delay`));
  steps.push(step({ bankOf: "PIR1", clear: { reg: "PIR1", bit: "TMR2IF", why: "no stale match" } }));
  put(write("PIE1", 0x02, "0x02", "TMR2IE = 1"));
  put(
    write(
      "IOCAP",
      Number(iocap),
      iocap,
      `rising edges on ${plan.input.port}: ${edge !== "falling" ? "on" : "off"}`,
    ),
  );
  put(
    write(
      "IOCAN",
      Number(iocan),
      iocan,
      `falling edges on ${plan.input.port}: ${edge !== "rising" ? "on" : "off"}`,
    ),
  );
  put(write("IOCAF", 0, "0x00", "no stale edge"));
  put(write("INTCON", 0xc8, "0xC8", "GIE = 1, PEIE = 1, IOCIE = 1"));
  return {
    config,
    steps,
    outBit,
    inBit,
    onLevel,
    offLevel,
    prDelay,
    prHigh,
    prescale,
    t2con,
    iocap,
    iocan,
    restart: start === "trigger" && plan.retrigger === "restart",
    zeroCross: start === "zero-cross",
    edgeWords: plan.edgeSetting ?? edge,
    activeLow,
  };
}
