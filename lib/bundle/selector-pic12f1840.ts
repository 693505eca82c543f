// PIC12F1840 firmware part that keeps the old stage's selector switch: one
// input per position on RA4, RA5, RA1, RA0 (in that order; weak pull-ups,
// the switch's common contact to ground, so the selected position reads
// low), debounced over 1 ms samples, and the engine's selector table as PR2
// and CCPR1L per position of the Timer2 + CCP1 PWM. Two renderings of the
// same positions: src/selector_control.inc (gpasm, included by src/main.asm:
// the image) and src/selector_control.h (for the vendor's C compiler).
// Pin choice: RA2 is the CCP1 output; RA3 is input-only and stays MCLR (the
// reset and the programming voltage); RA0/RA1 are ICSPDAT/ICSPCLK, so they
// come last: a two-position switch leaves them free, and with three or four
// positions the pin map says to set the switch to position 1 or 2 (or unplug
// it) while programming. RA4/RA5 are OSC2/CLKIN, so a crystal or external
// clock is refused.
// Facts: PIC12(L)F1840 datasheet DS40001441, I/O Ports chapter (ANSELA
// clear for a digital input, TRISA, WPUA, OPTION_REG nWPUEN = 0 enables the
// weak pull-ups of the bits set in WPUA), Timer2/CCP chapters (CCPR1L latched
// at the end of a period; PR2 is not buffered).
import { EngineError, type SelectorTable } from "@/lib/engine";
import { picConfig } from "./device-pic12f1840";
import { render } from "./render";
import { SELECTOR_DEBOUNCE_MS, selectorWiringLines, type WiringLine } from "./selector-common";
import type { BundlePlan } from "./types";

/** Inputs in position order (8-pin package pins from memory: RA4 3, RA5 2, RA1 6, RA0 7). */
const PIC_SELECTOR_PINS = [
  { bit: 4, packagePin: 3, note: "" },
  { bit: 5, packagePin: 2, note: "" },
  {
    bit: 1,
    packagePin: 6,
    note: "; also ICSPCLK: set the switch to position 1 or 2 (or unplug it) while programming",
  },
  {
    bit: 0,
    packagePin: 7,
    note: "; also ICSPDAT: set the switch to position 1 or 2 (or unplug it) while programming",
  },
] as const;
const T2CKPS: Record<number, number> = { 1: 0, 4: 1, 16: 2, 64: 3 };
/** Instruction cycles from TMR2IF seen to the PR2 write in sel_apply (counted from the .inc, as in adc-pic12f1840.ts). */
const PR2_WRITE_CYCLES = 12;

export function pic12f1840SelectorWiring(
  table: SelectorTable,
  valueText: (v: number) => string,
): WiringLine[] {
  const inputs = PIC_SELECTOR_PINS.map((p) => ({
    name: `RA${p.bit}`,
    packagePin: p.packagePin,
    note: p.note,
  }));
  return selectorWiringLines(table, valueText, inputs, "weak pull-up (WPUA)", {
    role: "switch common contact to ground (contacts on RA4 and RA5 first, then RA1, RA0: RA2 is the output, RA3 stays MCLR for reset and the programming voltage, RA0/RA1 carry ICSP programming)",
    pin: "VSS",
    packagePin: 8,
  });
}

const hex2 = (v: number) => `0x${v.toString(16).toUpperCase().padStart(2, "0")}`;

export function renderPic12f1840Selector({
  table,
  startIndex,
  controlText,
}: {
  table: SelectorTable;
  startIndex: number;
  controlText: string;
}): { asm: string; c: string } {
  const plan = table.plan as unknown as BundlePlan;
  if (plan.device !== "pic12f1840" || plan.timer.toUpperCase() !== "TIMER2" || plan.mode !== "pwm")
    throw new Error("The selector part runs on PIC12F1840 Timer2 + CCP1 PWM plans.");
  const n = table.positions.length;
  if (n < 2 || n > PIC_SELECTOR_PINS.length)
    throw new EngineError(
      "invalid-request",
      `control.values: the PIC12F1840 reads 2 to ${PIC_SELECTOR_PINS.length} selector positions (RA4, RA5, RA1, RA0; RA2 is the output, RA3 the reset pin); this selector has ${n}.`,
      "control.values",
    );
  const pins = PIC_SELECTOR_PINS.slice(0, n);
  if (pins.some((p) => plan.pin.port === `RA${p.bit}`))
    throw new EngineError(
      "invalid-request",
      `${plan.pin.port} is the output and cannot be a selector input.`,
      "pin",
    );
  const fosc = picConfig(plan).fosc;
  if (fosc !== "INTOSC")
    throw new EngineError(
      "invalid-request",
      "clockSource: a crystal or external clock takes RA4/RA5, the selector's first inputs; use the internal oscillator.",
      "clockSource",
    );
  const prescale = plan.divider / 4;
  const ckps = T2CKPS[prescale];
  if (ckps === undefined) throw new Error(`divider ${plan.divider} is not 4 x a Timer2 prescale.`);
  for (const p of table.positions) {
    if (p.periodCounts > 256 || p.highCounts > 255)
      throw new Error(
        `control: position ${p.position} needs ${p.periodCounts} counts, more than Timer2's 256.`,
      );
    if (p.periodCounts - 1 <= Math.ceil(PR2_WRITE_CYCLES / prescale) + 1)
      throw new Error(
        `control: position ${p.position} (${p.periodCounts} counts) is too short to change PR2 safely at prescale ${prescale}.`,
      );
  }
  // 1 ms in turns of decfsz + goto (3 instruction cycles, DS40001441 instruction set), 16-bit count
  const msLoops = Math.max(257, Math.round(plan.clockHz / 4 / 1000 / 3));
  if (msLoops > 65535) throw new Error("clockHz: the 1 ms loop counter is 16 bits.");
  const mask = pins.reduce((m, p) => m | (1 << p.bit), 0);
  const ctx = {
    controlText,
    debounceMs: SELECTOR_DEBOUNCE_MS,
    noContactRule: table.noContactRule,
    startIndex,
    startPosition: startIndex + 1,
    outPin: plan.pin.port,
    prescale,
    t2con: hex2(0x04 | ckps),
    mask: hex2(mask),
    notMask: hex2(0xff ^ mask),
    pinList: pins.map((p) => `RA${p.bit}`).join(", "),
    msLoops,
    msLow: msLoops & 0xff || 1,
    msHigh: (msLoops >> 8) + 1,
    positions: table.positions.map((p, i) => ({
      position: p.position,
      index: i,
      bit: pins[i].bit,
      pr2: p.periodCounts - 1,
      ccpr1l: p.highCounts,
    })),
  };
  return {
    asm: render("pic12f1840/selector-control.inc.hbs", ctx),
    c: render("pic12f1840/selector-control.h.hbs", ctx),
  };
}
