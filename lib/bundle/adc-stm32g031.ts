// STM32G031 firmware part that keeps the old stage's rate potentiometer: the
// wiper on PA4 (ADC_IN4), the engine's ADC table (12-bit, buildAdcTable) as
// ARR/CCR per step of the plan's TIM2/TIM3 channel. Rendered from
// templates/stm32g031/adc-control.h.hbs. Facts: RM0444, ADC chapter
// (calibration with ADEN = 0 after the regulator start-up, CKMODE written
// while the ADC is off, CHSELR then CCRDY, ADEN then ADRDY), general-purpose
// timers (ARPE and OCxPE preload). PA4 = ADC_IN4 and the TSSOP-20 pin are
// from memory (datasheet pin table).
import type { AdcTable } from "@/lib/engine";
import { adcClock } from "./adc-clock";
import { stm32g031View } from "./device-stm32g031";
import { render } from "./render";
import type { BundlePlan } from "./types";

/** Regulator start-up before calibration: 20 us (tADCVREG_STUP, datasheet; from memory). */
export const STM32_ADC_REGULATOR_S = 20e-6;

/** ADC channel -> GPIOA bit (PA0..PA7 = ADC_IN0..ADC_IN7, from memory). */
const STM_ADC_PINS: Record<number, number> = { 0: 0, 1: 1, 4: 4, 5: 5, 6: 6, 7: 7 };

export const STM32G031_POT_WIRING = [
  { role: "supply (pot top)", pin: "VDD/VDDA", packagePin: 4 },
  { role: "wiper", pin: "PA4 (ADC_IN4)", packagePin: 10 },
  { role: "ground (pot bottom)", pin: "VSS/VSSA", packagePin: 5 },
  { role: "filter capacitor 100 nF from the wiper to ground", pin: "PA4", packagePin: 10 },
] as const;

export function renderStm32g031Adc({
  table,
  channel = 4,
  controlText,
}: {
  table: AdcTable;
  channel?: number;
  controlText: string;
}): string {
  const plan = table.plan as unknown as BundlePlan;
  if (plan.device !== "stm32g031" || plan.mode !== "pwm" || plan.modeFactor !== 1)
    throw new Error("The ADC control part runs on STM32G031 edge-aligned PWM plans.");
  if (table.adcBits !== 12) throw new Error("adcBits: the STM32G031 ADC has 12 bits.");
  const bit = STM_ADC_PINS[channel];
  if (bit === undefined) throw new Error("channel: ADC_IN0, 1 or 4..7 (PA0, PA1, PA4..PA7).");
  if (plan.pin.port === `PA${bit}`) throw new Error(`channel: PA${bit} is the timing output.`);
  const view = stm32g031View(plan);
  const x = view.extra as { tim: string; ch: number };
  const clk = adcClock("stm32g031", plan.clockHz);
  const last = table.steps.length - 1;
  return render("stm32g031/adc-control.h.hbs", {
    controlText,
    clockHz: plan.clockHz,
    countsPerStep: table.countsPerStep,
    hysteresis: table.hysteresisCounts,
    tim: x.tim,
    ch: x.ch,
    psc: plan.divider - 1,
    adc: {
      channel,
      pin: `PA${bit}`,
      modeShift: bit * 2,
      ckmode: clk.bits,
      divider: clk.divider,
      clockHz: clk.adcClockHz,
      minHz: clk.rangeHz.min,
      maxHz: clk.rangeHz.max,
      regulatorLoops: Math.ceil(plan.clockHz * STM32_ADC_REGULATOR_S),
    },
    steps: table.steps.map((s) => ({
      arr: s.periodCounts - 1,
      ccr: s.highCounts,
      note: s.index === 0 ? "minimum" : s.index === last ? "maximum" : "",
    })),
  });
}
