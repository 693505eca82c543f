// PIC12F1840 firmware part that keeps the old stage's rate potentiometer: the
// wiper on RA4 (AN3), read 10-bit against VDD, and the engine's ADC table
// (buildAdcTable, the old stage's own law) as PR2 and CCPR1L per step of the
// Timer2 + CCP1 PWM. Two renderings of the same table and steps:
// src/adc_control.inc (gpasm, included by src/main.asm: the image) and
// src/adc_control.h (for the vendor's C compiler, included by src/main.c).
// Facts: PIC12(L)F1840 datasheet DS40001441, ADC chapter (ADCON0 CHS<4:0>
// GO/nDONE ADON; ADCON1 ADFM ADCS<2:0> ADPREF<1:0>, ADPREF = 00 is VDD;
// AN3 on RA4; TAD table via adc-clock.ts), CCP chapter (CCPR1L latched into
// CCPR1H at the end of a period; PR2 is not buffered), Timer2 (TMR2IF when
// TMR2 matches PR2 and restarts).
import type { AdcTable } from "@/lib/engine";
import { adcClock } from "./adc-clock";
import { picConfig } from "./device-pic12f1840";
import { render } from "./render";
import type { BundlePlan } from "./types";

/** AN channel -> RA bit (DS40001441 pin allocation table: AN0 RA0, AN1 RA1, AN2 RA2, AN3 RA4). */
const PIC_AN_BITS: Record<number, number> = { 0: 0, 1: 1, 2: 2, 3: 4 };
/** Package pins of RA0..RA5 on the 8-pin packages (DS40001441 pin diagram; from memory). */
const RA_PACKAGE_PIN = [7, 6, 5, 4, 3, 2];

/**
 * Acquisition time before each conversion: 5 us covers the datasheet's
 * acquisition example (about 4.4 us with a 10 kOhm source at 50 degC;
 * DS40001441 ADC acquisition requirements, from memory). The pot's filter
 * capacitor makes the source far stiffer than 10 kOhm.
 */
export const PIC_ACQUISITION_S = 5e-6;
/** Instruction cycles from TMR2IF seen to the PR2 write in adj_apply (counted from the .inc: btfss, goto, movf, call, brw, retlw, movlb, movwf). */
const PR2_WRITE_CYCLES = 12;

export const PIC12F1840_POT_WIRING = [
  { role: "supply (pot top)", pin: "VDD", packagePin: 1 },
  { role: "wiper", pin: "RA4 (AN3)", packagePin: 3 },
  { role: "ground (pot bottom)", pin: "VSS", packagePin: 8 },
  { role: "filter capacitor 100 nF from the wiper to ground", pin: "RA4", packagePin: 3 },
] as const;

const hex2 = (v: number) => `0x${v.toString(16).toUpperCase().padStart(2, "0")}`;

export function renderPic12f1840Adc({
  table,
  channel = 3,
  controlText,
}: {
  table: AdcTable;
  channel?: number;
  controlText: string;
}): { asm: string; c: string } {
  const plan = table.plan as unknown as BundlePlan;
  if (plan.device !== "pic12f1840" || plan.timer.toUpperCase() !== "TIMER2" || plan.mode !== "pwm")
    throw new Error("The ADC control part runs on PIC12F1840 Timer2 + CCP1 PWM plans.");
  if (table.adcBits !== 10) throw new Error("adcBits: the PIC12F1840 ADC has 10 bits.");
  // The step index is the top six bits of the 10-bit result (swapf), so 16 counts per step.
  if (table.countsPerStep !== 16 || table.steps.length !== 64)
    throw new Error("steps: the PIC12F1840 ADC part reads 64 steps of 16 counts.");
  const bit = PIC_AN_BITS[channel];
  if (bit === undefined) throw new Error("channel: AN0..AN3 (RA0, RA1, RA2, RA4).");
  if (plan.pin.port === `RA${bit}`) throw new Error(`channel: RA${bit} is the timing output.`);
  const config = picConfig(plan);
  if (bit === 4 && (config.fosc === "LP" || config.fosc === "XT" || config.fosc === "HS"))
    throw new Error(
      "clockSource: a crystal takes RA4 (OSC2), the rate pot's input AN3; use the internal oscillator or an external clock into CLKIN.",
    );
  const clk = adcClock("pic12f1840", plan.clockHz);
  const prescale = plan.divider / 4;
  const lowest = Math.min(...table.steps.map((s) => s.periodCounts));
  if (lowest - 1 <= Math.ceil(PR2_WRITE_CYCLES / prescale) + 1)
    throw new Error(
      `control: the shortest step (${lowest} counts) is too short to change PR2 safely at prescale ${prescale}; choose a lower clock.`,
    );
  for (const s of table.steps)
    if (s.periodCounts > 256 || s.highCounts > 255)
      throw new Error(`control: step ${s.index} needs ${s.periodCounts} counts, more than Timer2's 256.`);
  // Acquisition delay loop: decfsz + goto = 3 instruction cycles per turn.
  const acqLoops = Math.max(1, Math.ceil((PIC_ACQUISITION_S * plan.clockHz) / 4 / 3));
  if (acqLoops > 255) throw new Error("clockHz: the acquisition loop counter is 8 bits.");
  const last = table.steps.length - 1;
  const ctx = {
    controlText,
    clockHz: plan.clockHz,
    countsPerStep: table.countsPerStep,
    hysteresis: table.hysteresisCounts,
    keepDownFrom: table.countsPerStep - table.hysteresisCounts,
    prescale,
    outPin: plan.pin.port,
    adc: {
      channel,
      pin: `RA${bit}`,
      bit,
      packagePin: RA_PACKAGE_PIN[bit],
      adcon0: hex2((channel << 2) | 1),
      // ADFM = 1 (right justified), ADCS, ADPREF = 00 (VDD)
      adcon1: hex2(0x80 | (clk.bits << 4)),
      adcsBits: clk.bits.toString(2).padStart(3, "0"),
      divider: clk.divider,
      tadUs: Number(((clk.divider / plan.clockHz) * 1e6).toPrecision(4)),
      acqLoops,
      acqUs: Number((((acqLoops * 3 * 4) / plan.clockHz) * 1e6).toPrecision(3)),
    },
    steps: table.steps.map((s) => ({
      pr2: s.periodCounts - 1,
      // CCPR1L:DC1B = 4 * highCounts (quarter counts); the table's high counts are whole, so DC1B = 0
      ccpr1l: s.highCounts,
      note: s.index === 0 ? "minimum" : s.index === last ? "maximum" : "",
    })),
  };
  for (const s of table.steps)
    if (!Number.isInteger(s.highCounts)) throw new Error("control: the table's high counts must be whole.");
  return {
    asm: render("pic12f1840/adc-control.inc.hbs", ctx),
    c: render("pic12f1840/adc-control.h.hbs", ctx),
  };
}
