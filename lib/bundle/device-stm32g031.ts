// STM32G031, TIM2 (32-bit) or TIM3 (16-bit). RM0444 reference manual:
// general-purpose timers (PSC, ARR, CCRx, CCMRx OCxM = 110 PWM mode 1,
// 011 toggle), RCC (HSIDIV, PLL, IOPENR, APBENR1), GPIO (MODER, AFRx, BSRR).
// Alternate function numbers: STM32G031 datasheet port A/B AF tables (TIM3
// channels on AF1, TIM2 channels on AF2; from memory).
import { EngineError } from "@/lib/engine/errors";
import { intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { pinFacts } from "./pins";
import type { BundlePlan } from "./types";

const HSI16 = 16e6;

export interface StmClock {
  kind: "hsi" | "pll" | "hse";
  /** PLL input: HSI16, or an 8 MHz HSE crystal (common practice, no source) */
  pllFromHse?: boolean;
  hsidiv?: number;
  pllN?: number;
  pllR?: number;
  flashLatency: number;
}

/** 8 MHz HSE crystal behind the PLL (common practice, no source). */
export const HSE_PLL_CRYSTAL_HZ = 8e6;

/** How the clock tree reaches clockHz from the plan's clock source (RM0444 RCC chapter). */
export function stmClock(clockHz: number, source = "hsi16"): StmClock {
  const latency = clockHz > 48e6 ? 2 : clockHz > 24e6 ? 1 : 0;
  const hsi = source.startsWith("hsi");
  if (hsi) {
    for (let k = 0; k <= 7; k++) {
      if (HSI16 / 2 ** k === clockHz) return { kind: "hsi", hsidiv: k, flashLatency: latency };
    }
  }
  if (source === "hse") {
    if (clockHz >= 4e6 && clockHz <= 48e6) return { kind: "hse", flashLatency: latency };
  } else if (source !== "lse") {
    const fin = hsi ? HSI16 : HSE_PLL_CRYSTAL_HZ;
    for (let r = 2; r <= 8; r++) {
      for (let n = 8; n <= 86; n++) {
        const vco = fin * n;
        if (vco >= 64e6 && vco <= 344e6 && vco / r === clockHz && clockHz <= 64e6) {
          return { kind: "pll", pllN: n, pllR: r, pllFromHse: !hsi, flashLatency: latency };
        }
      }
    }
  }
  throw new EngineError("clock-out-of-range", `stm32g031: no clock set-up for ${clockHz} Hz from ${source}`);
}

export function stm32g031View(plan: BundlePlan): DeviceView {
  const tim = plan.timer.toUpperCase();
  if (tim !== "TIM2" && tim !== "TIM3") unsupported(plan, `timer ${plan.timer}`);
  const m = /^P([AB])(\d{1,2})$/.exec(plan.pin.port) ?? unsupported(plan, `pin ${plan.pin.port}`);
  const portLetter = m[1];
  const portBit = Number(m[2]);
  const chMatch = /CH([1-4])/.exec(plan.pin.function);
  const ch = chMatch ? Number(chMatch[1]) : 1;
  const af = plan.pin.alternateFunction ?? (tim === "TIM3" ? 1 : 2);
  const psc = intRange(plan, "PSC", plan.divider - 1, 0, 65535);
  const arr = intRange(plan, "ARR", plan.periodCounts - 1, 1, tim === "TIM2" ? 0xffffffff : 65535);
  const ccmr = ch <= 2 ? "CCMR1" : "CCMR2";
  const shift = ch % 2 === 1 ? 0 : 8;
  const writes: RegisterWrite[] = [
    write("PSC", psc, String(psc), `PSC = divider - 1; counter clock = f_TIM/${psc + 1}`),
    write("ARR", arr, String(arr), `ARR = periodCounts - 1; update every (PSC+1)*(ARR+1)/f_TIM`),
  ];
  const isr = plan.mode === "isr";
  if (plan.mode === "pwm") {
    const ccr = intRange(plan, `CCR${ch}`, plan.highCounts, 0, arr + 1);
    writes.push(
      write(
        `CCR${ch}`,
        ccr,
        String(ccr),
        `PWM mode 1: high while CNT < CCR${ch}; high = CCR${ch}*(PSC+1)/f_TIM`,
      ),
      write(
        ccmr,
        ((6 << 4) | (1 << 3)) << shift,
        `(6u << ${shift + 4}) | (1u << ${shift + 3})`,
        `OC${ch}M = 110 (PWM mode 1), OC${ch}PE = 1`,
      ),
      write(
        "CCER",
        1 << (4 * (ch - 1)),
        `1u << ${4 * (ch - 1)}`,
        `CC${ch}E = 1: output enabled, active high`,
      ),
    );
  } else if (plan.mode === "toggle") {
    writes.push(
      write(`CCR${ch}`, 0, "0", `toggle when CNT = 0; period = 2*(PSC+1)*(ARR+1)/f_TIM`),
      write(ccmr, 3 << (shift + 4), `3u << ${shift + 4}`, `OC${ch}M = 011 (toggle on match)`),
      write("CCER", 1 << (4 * (ch - 1)), `1u << ${4 * (ch - 1)}`, `CC${ch}E = 1: output enabled`),
    );
  } else if (isr) {
    writes.push(write("DIER", 1, "1u << 0", "UIE = 1: update interrupt on"));
  }
  writes.push(
    write("EGR", 1, "1u << 0", "UG = 1: load PSC and ARR before the start"),
    write("CR1", 0x81, "(1u << 7) | (1u << 0)", "ARPE = 1 (buffered ARR), CEN = 1: starts the counter"),
  );
  return {
    writes,
    pin: pinFacts(plan),
    extra: {
      tim,
      ch,
      af,
      portLetter,
      portBit,
      isr,
      apbBit: tim === "TIM2" ? 0 : 1,
      irq: tim === "TIM2" ? 15 : 16,
      handler: `${tim}_IRQHandler`,
      afr: portBit < 8 ? 0 : 1,
      afShift: (portBit % 8) * 4,
      modeShift: portBit * 2,
      clock: stmClock(plan.clockHz, plan.clockSource),
    },
  };
}
