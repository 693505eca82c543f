// MSP430G2553 firmware part that keeps the old stage's rate potentiometer: the
// wiper on P1.4 (A4), read by ADC10 against VCC, and the engine's ADC table
// (buildAdcTable, the old stage's own law) as TA0CCR0 and TA0CCR1 per step of
// the Timer0_A3 PWM. Rendered from templates/msp430g2553/adc-control.h.hbs.
// Facts: MSP430x2xx Family User's Guide SLAU144, ADC10 chapter (ADC10CTL0
// SREFx = 000 is VR+ = VCC, VR- = VSS; ADC10SHTx sample-and-hold time;
// ADC10ON; ENC and ADC10SC start a conversion; ADC10CTL1 INCHx, SHSx = 00
// (ADC10SC), ADC10DIVx, ADC10SSELx, CONSEQx = 00 single channel single
// conversion, ADC10BUSY; ADC10AE0 analog enable per pin; control bits change
// only while ENC = 0) and Timer_A chapter (up mode: a TACCR0 below the running
// count makes the timer roll to zero, so the period register is changed just
// after CCIFG of TACCR0). Pin A4 = P1.4 on package pin 6 (MSP430G2x53
// datasheet SLAS735 pin table; from memory).
import type { AdcTable } from "@/lib/engine";
import { adcClock } from "./adc-clock";
import { msp430ClockSetup } from "./device-msp430g2553";
import { render } from "./render";
import type { BundlePlan } from "./types";

/** PDIP-20 / TSSOP-20 package pin of P1.0..P1.7 (SLAS735 pin diagram; from memory). */
const P1_PACKAGE_PIN = [2, 3, 4, 5, 6, 7, 14, 15];

/**
 * ADC10SHT_3: 64 ADC10CLK sample time. SLAU144's sample timing rule
 * t_sample > (R_S + R_I) * ln(2^11) * C_I with R_I = 2 kOhm and C_I = 27 pF
 * (ADC10 chapter, sample timing considerations) gives 64 cycles at 6.3 MHz =
 * 10.2 us for a source up to about 47 kOhm; the wiper's filter capacitor makes
 * it far stiffer.
 */
export const MSP_SAMPLE_CYCLES = 64;
/** ADC10OSC range used when SMCLK does not run from the calibrated DCO (MSP430G2x53 datasheet, 10-bit ADC; from memory). */
export const MSP_ADC10OSC_HZ = { min: 3.7e6, max: 6.3e6 } as const;

export const MSP430G2553_POT_WIRING = [
  { role: "supply (pot top)", pin: "DVCC", packagePin: 1 },
  { role: "wiper", pin: "P1.4 (A4)", packagePin: 6 },
  { role: "ground (pot bottom)", pin: "DVSS", packagePin: 20 },
  { role: "filter capacitor 100 nF from the wiper to ground", pin: "P1.4", packagePin: 6 },
] as const;

export function renderMsp430g2553Adc({
  table,
  channel = 4,
  controlText,
}: {
  table: AdcTable;
  channel?: number;
  controlText: string;
}): string {
  const plan = table.plan as unknown as BundlePlan;
  if (plan.device !== "msp430g2553" || plan.mode !== "pwm" || plan.modeFactor !== 1)
    throw new Error("The ADC control part runs on MSP430G2553 Timer0_A3 PWM plans.");
  if (table.adcBits !== 10) throw new Error("adcBits: the MSP430G2553 ADC10 has 10 bits.");
  if (!Number.isInteger(channel) || channel < 0 || channel > 7)
    throw new Error("channel: A0..A7 are P1.0..P1.7.");
  if (plan.pin.port === `P1.${channel}`) throw new Error(`channel: P1.${channel} is the timing output.`);
  const clock = msp430ClockSetup(plan);
  // SMCLK is the plan's clock only with the calibrated DCO; otherwise the ADC runs from its own ADC10OSC.
  const smclk = clock.source === "dco-cal" ? adcClock("msp430g2553", plan.clockHz) : null;
  const last = table.steps.length - 1;
  for (const s of table.steps)
    if (s.periodCounts > 65536) throw new Error(`control: step ${s.index} needs more than 65536 counts.`);
  return render("msp430g2553/adc-control.h.hbs", {
    controlText,
    countsPerStep: table.countsPerStep,
    hysteresis: table.hysteresisCounts,
    adc: {
      channel,
      pin: `P1.${channel}`,
      packagePin: P1_PACKAGE_PIN[channel],
      ssel: smclk ? "ADC10SSEL_3" : "ADC10SSEL_0",
      div: `ADC10DIV_${smclk ? smclk.bits : 0}`,
      clockText: smclk
        ? `SMCLK/${smclk.divider} = ${smclk.adcClockHz} Hz, inside ${smclk.rangeHz.min}..${smclk.rangeHz.max} Hz`
        : `ADC10OSC, ${MSP_ADC10OSC_HZ.min}..${MSP_ADC10OSC_HZ.max} Hz (SMCLK is not the calibrated DCO here)`,
      sampleCycles: MSP_SAMPLE_CYCLES,
    },
    steps: table.steps.map((s) => ({
      ccr0: s.periodCounts - 1,
      ccr1: s.highCounts,
      note: s.index === 0 ? "minimum" : s.index === last ? "maximum" : "",
    })),
  });
}
