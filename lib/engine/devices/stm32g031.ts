// STM32G031. Reference: RM0444 reference manual (STM32G0x1), general-purpose
// timers TIM2/TIM3 (PSC, ARR, CCMR1 OC1M, CCER CC1E, CR1, DIER, EGR) and RCC
// clock tree (timer clock = 2 x PCLK when the APB prescaler is not 1);
// STM32G031x4/x6/x8 datasheet for the pinout and alternate functions.
import { pin, range, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";

const PKG = "TSSOP-20";
const PSC_DIVIDERS = range(1, 65536);

function generalTimer(name: "TIM2" | "TIM3", bits: 16 | 32, p: ReturnType<typeof pin>): TimerSpec {
  const maxCounts = 2 ** bits;
  return {
    name,
    bits,
    dividers: PSC_DIVIDERS,
    isrDividers: PSC_DIVIDERS,
    dividerQuantum: 1,
    // ARR = 0 stops the counter, so at least 2 counts.
    counts: {
      pwm: { min: 2, max: maxCounts },
      toggle: { min: 2, max: maxCounts },
      isr: { min: 2, max: maxCounts },
    },
    modeFactors: { pwm: [1], toggle: [2] },
    highStep: 1,
    pins: { pwm: p, toggle: p, isr: { ...p, function: "GPIO", alternateFunction: undefined } },
    registers(c: TimerConfig): Record<string, number> {
      const base = { PSC: c.divider - 1, ARR: c.periodCounts - 1 };
      // CR1: ARPE 7, CEN 0. EGR: UG 0. CCER: CC1E 0. CCMR1: OC1M 6:4, OC1PE 3. DIER: UIE 0.
      if (c.mode === "pwm")
        return { ...base, CCR1: c.highCounts, CCMR1: (0b110 << 4) | (1 << 3), CCER: 1, CR1: 0x81, EGR: 1 };
      if (c.mode === "toggle") return { ...base, CCR1: 0, CCMR1: 0b011 << 4, CCER: 1, CR1: 0x81, EGR: 1 };
      return { ...base, DIER: 1, CR1: 0x81, EGR: 1 };
    },
    notes: () => [
      "clockHz is the timer kernel clock: twice PCLK when the APB prescaler is not 1 (RM0444 clock tree).",
    ],
  };
}

export const stm32g031: DeviceSpec = {
  id: "stm32g031",
  name: "STM32G031",
  family: "STM32G0 (Arm Cortex-M0+)",
  core: "cortex-m0plus",
  reference: "RM0444 reference manual; STM32G031 datasheet",
  minClockHz: 1e3,
  maxClockHz: 64e6,
  clocksPerCpuCycle: 1,
  isrLatencyCycles: 15,
  isrLatencySource: "Cortex-M0+ exception entry, 15 cycles with zero-wait-state memory (from memory)",
  clocks: [
    {
      id: "hse-pll",
      label: "HSE crystal 4-48 MHz through the PLL, up to 64 MHz",
      minHz: 1e6,
      maxHz: 64e6,
      accuracyPpm: 50,
      kind: "crystal",
      accuracySource: "common practice",
    },
    {
      id: "hse",
      label: "HSE crystal 4-48 MHz",
      minHz: 4e6,
      maxHz: 48e6,
      accuracyPpm: 50,
      kind: "crystal",
      accuracySource: "common practice",
    },
    {
      id: "hsi16",
      label: "HSI16 internal RC 16 MHz",
      hz: 16e6,
      accuracyPpm: 10000,
      kind: "internal",
      accuracySource: "+-1 % at 25 C, from memory",
    },
    {
      id: "hsi-pll",
      label: "HSI16 through the PLL, up to 64 MHz",
      minHz: 1e6,
      maxHz: 64e6,
      accuracyPpm: 10000,
      kind: "pll",
      accuracySource: "follows HSI16, from memory",
    },
    {
      id: "lse",
      label: "LSE 32.768 kHz watch crystal",
      hz: 32768,
      accuracyPpm: 20,
      kind: "crystal",
      accuracySource: "common practice",
    },
  ],
  defaultClock: "hse-pll",
  timers: [
    // TIM2_CH1 on PA0 (AF2), TIM3_CH1 on PA6 (AF1); TSSOP-20 pins 7 and 13 (from memory).
    generalTimer(
      "TIM2",
      32,
      pin({
        port: "PA0",
        function: "TIM2_CH1",
        packagePin: 7,
        package: PKG,
        portName: "A",
        bit: 0,
        alternateFunction: 2,
        fromMemory: true,
      }),
    ),
    generalTimer(
      "TIM3",
      16,
      pin({
        port: "PA6",
        function: "TIM3_CH1",
        packagePin: 13,
        package: PKG,
        portName: "A",
        bit: 6,
        alternateFunction: 1,
        fromMemory: true,
      }),
    ),
  ],
  toolchain: {
    compiler: "arm-none-eabi-gcc",
    target: "-mcpu=cortex-m0plus -mthumb",
    header: "stm32g031xx.h",
  },
};
