// RP2040 firmware part (clk_adc 48 MHz from PLL_USB) that keeps the old stage's rate potentiometer: the
// engine's ADC table (12-bit, buildAdcTable) as TOP/CC per step, the wiper on
// GPIO26..29 (ADC0..3). Rendered from templates/rp2040/adc-control.h.hbs.
// Facts: RP2040 datasheet, ADC section 4.9 (GPIO26..29 = AIN0..3, 12 bits),
// PWM (edge-aligned: high while counter < CC; TOP and CC double buffered).
import type { AdcTable } from "@/lib/engine";
import { render } from "./render";

/** Pot wiring (RP2040 datasheet pin list, QFN-56; from memory). */
export const RP2040_POT_WIRING = [
  { role: "supply (pot top)", pin: "ADC_AVDD", packagePin: 43 },
  { role: "wiper", pin: "GPIO26 (ADC0)", packagePin: 38 },
  { role: "ground (pot bottom)", pin: "GND", packagePin: 57 },
  { role: "filter capacitor 100 nF from the wiper to ground", pin: "GPIO26", packagePin: 38 },
] as const;

export function renderRp2040Adc({
  table,
  channel = 0,
  controlText,
}: {
  table: AdcTable;
  channel?: number;
  controlText: string;
}): string {
  const plan = table.plan;
  if (plan.device !== "rp2040" || plan.mode !== "pwm" || plan.modeFactor !== 1)
    throw new Error("The ADC control part runs on RP2040 edge-aligned PWM plans.");
  if (table.adcBits !== 12) throw new Error("adcBits: the RP2040 ADC has 12 bits.");
  if (!Number.isInteger(channel) || channel < 0 || channel > 3)
    throw new Error("channel: ADC0..ADC3 (GPIO26..29).");
  const gpio = plan.pin.gpio ?? Number(/\d+/.exec(plan.pin.port)?.[0]);
  const last = table.steps.length - 1;
  const div16 = Math.round(plan.divider * 16);
  if (Math.abs(div16 - plan.divider * 16) > 1e-9 || div16 < 16 || div16 > 4095)
    throw new Error(`divider ${plan.divider}: the PWM DIV register takes 1..255 in 1/16 steps.`);
  return render("rp2040/adc-control.h.hbs", {
    divider: plan.divider,
    divInt: Math.floor(div16 / 16),
    divFrac: div16 % 16,
    controlText,
    countsPerStep: table.countsPerStep,
    hysteresis: table.hysteresisCounts,
    slice: (gpio >> 1) & 7,
    channelB: (gpio & 1) === 1,
    adc: { channel, gpio: 26 + channel },
    steps: table.steps.map((s) => ({
      top: s.periodCounts - 1,
      compare: s.highCounts,
      note: s.index === 0 ? "minimum" : s.index === last ? "maximum" : "",
    })),
  });
}
