// STM32G031. Reference: RM0444 reference manual (STM32G0x1), general-purpose
// timers TIM2/TIM3 (PSC, ARR, CCMR1 OC1M, CCER CC1E, CR1, DIER, EGR) and RCC
// clock tree (timer clock = 2 x PCLK when the APB prescaler is not 1);
// STM32G031x4/x6/x8 datasheet (DS12992) for the pinout and alternate functions.
// Default package: TSSOP-20 (STM32G031F4/6/8Px). There PC14 carries OSC_IN
// (and OSC32_IN) but no pin carries OSC_OUT, so an HSE crystal cannot
// oscillate: the clock options are HSI16 (directly or through the PLL) and an
// external clock into PC14-OSC_IN with the HSE bypass. The timers cannot run
// from the LSE, so no LSE option is offered.
import { EngineError } from "../errors";
import type { ClockOption } from "../plan-types";
import { pin, range, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";
import {
  EXT_CLOCK_MAX_HZ,
  EXT_CLOCK_MIN_HZ,
  HSI16_FREQUENCIES_HZ,
  stm32ClockTree,
} from "./stm32g031-clock-tree";

const PKG = "TSSOP-20";

function checkClock(clock: ClockOption, clockHz: number): void {
  if (stm32ClockTree(clock.id, clockHz)) return;
  const what =
    clock.id === "hsi16"
      ? "16 MHz divided by 1, 2, 4 ... 128, or a PLL output HSI16 / M * N / R up to 64 MHz (RM0444 RCC_PLLCFGR)"
      : `${EXT_CLOCK_MIN_HZ} Hz to ${EXT_CLOCK_MAX_HZ} Hz`;
  throw new EngineError(
    "clock-out-of-range",
    `STM32G031 ${clock.label}: ${clockHz} Hz cannot be made; this source makes ${what}.`,
    "clockHz",
  );
}
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
  reference: "RM0444 reference manual; STM32G031x4/x6/x8 datasheet (DS12992)",
  minClockHz: 125e3,
  maxClockHz: 64e6,
  clocksPerCpuCycle: 1,
  isrLatencyCycles: 15,
  isrLatencySource: "Cortex-M0+ exception entry, 15 cycles with zero-wait-state memory (from memory)",
  clocks: [
    {
      id: "hsi16",
      label: "HSI16 internal RC: 16 MHz divided by 1 to 128, or through the PLL up to 64 MHz",
      minHz: HSI16_FREQUENCIES_HZ[0],
      maxHz: HSI16_FREQUENCIES_HZ[HSI16_FREQUENCIES_HZ.length - 1],
      frequenciesHz: [...HSI16_FREQUENCIES_HZ],
      accuracyPpm: 10000,
      kind: "internal",
      accuracySource: "+-1 % at 25 C, from memory",
    },
    {
      id: "ext-clock",
      label: "External clock into PC14-OSC_IN (HSE bypass), 1 to 48 MHz",
      minHz: EXT_CLOCK_MIN_HZ,
      maxHz: EXT_CLOCK_MAX_HZ,
      // An oscillator module's accuracy; state the one on the board with clockAccuracyPpm.
      accuracyPpm: 50,
      kind: "external",
      accuracySource: "a packaged crystal oscillator, common practice, no source",
    },
  ],
  defaultClock: "hsi16",
  timers: [
    // TIM2_CH1 on PA0 (AF2), TIM3_CH1 on PA6 (AF1): ST's pin data for the STM32G031
    // (alternate function table). TSSOP-20 pins 7 and 13: DS12992 TSSOP20 pinout.
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
      }),
    ),
  ],
  toolchain: {
    compiler: "arm-none-eabi-gcc",
    target: "-mcpu=cortex-m0plus -mthumb",
    header: "stm32g031xx.h",
  },
  packages: [
    {
      // DS12992, STM32G031Fx TSSOP20 pinout: 4 VDD/VDDA, 5 VSS/VSSA, 6 PF2-NRST,
      // 18 PA13, 19 PA14-BOOT0/PA15, 2 PB9/PC14-OSC32_IN, 9 PA2, 10 PA3.
      name: PKG,
      servicePins: [
        {
          signal: "VDD/VDDA",
          role: "supply",
          packagePins: [4],
          notes:
            "2.0-3.6 V; 100 nF plus 4.7 uF to VSS close to the pin (digital and analog supply share this pin)",
        },
        { signal: "VSS/VSSA", role: "ground", packagePins: [5], notes: "ground, digital and analog" },
        {
          signal: "NRST",
          role: "reset",
          port: "PF2",
          packagePins: [6],
          notes: "reset, active low, internal pull-up; 100 nF to VSS; to the SWD header's reset line",
        },
        {
          signal: "SWDIO",
          role: "programming",
          port: "PA13",
          packagePins: [18],
          notes: "SWD data to the programming header; leave free of other loads",
        },
        {
          signal: "SWCLK",
          role: "programming",
          port: "PA14-BOOT0",
          packagePins: [19],
          notes: "SWD clock to the programming header; also BOOT0 (and bonded with PA15)",
        },
        {
          signal: "OSC_IN",
          role: "clock-in",
          port: "PC14",
          packagePins: [2],
          notes:
            "external clock input (HSE bypass) when the plan uses ext-clock; no OSC_OUT on this package, so no crystal (shares the pin with PB9)",
        },
        {
          signal: "USART2_TX",
          role: "boot",
          port: "PA2",
          packagePins: [9],
          notes: "ROM bootloader serial TX, only for flashing over the serial line",
          fromMemory: true,
        },
        {
          signal: "USART2_RX",
          role: "boot",
          port: "PA3",
          packagePins: [10],
          notes: "ROM bootloader serial RX, only for flashing over the serial line",
          fromMemory: true,
        },
      ],
    },
  ],
  checkClock,
};
