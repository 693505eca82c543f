// STM32G031, TIM2 (32-bit) or TIM3 (16-bit). RM0444 reference manual:
// general-purpose timers (PSC, ARR, CCRx, CCMRx OCxM = 110 PWM mode 1,
// 011 toggle), RCC (HSIDIV, PLL, IOPENR, APBENR1), GPIO (MODER, AFRx, BSRR).
// Alternate function numbers: STM32G031 datasheet port A/B AF tables (TIM3
// channels on AF1, TIM2 channels on AF2 on the pins used here).
import { stm32ClockTree, type Stm32ClockTree } from "@/lib/engine/devices/stm32g031-clock-tree";
import { EngineError } from "@/lib/engine/errors";
import { intRange, unsupported, write, type DeviceView, type RegisterWrite } from "./device-view";
import { pinFacts } from "./pins";
import type { BundlePlan } from "./types";

/**
 * The part the linker script and pin map are written for: STM32G031F8P6,
 * TSSOP-20, 64 KiB flash, 8 KiB SRAM (DS12992 ordering information and
 * memory map: x4 16 KiB, x6 32 KiB, x8 64 KiB flash; 8 KiB SRAM on all).
 */
export const STM32_PART = { name: "STM32G031F8P6", flashKiB: 64, ramKiB: 8 } as const;

/** How the clock tree reaches clockHz from the plan's clock source; refuses what the engine would refuse. */
export function stmClock(plan: BundlePlan): Stm32ClockTree {
  // A plan without a source (older callers) means the engine default, HSI16.
  const tree = stm32ClockTree(plan.clockSource ?? "hsi16", plan.clockHz);
  if (!tree)
    throw new EngineError(
      "clock-out-of-range",
      `stm32g031: no clock set-up for ${plan.clockHz} Hz from ${plan.clockSource}`,
      "clockHz",
    );
  return tree;
}

/** Programming steps: SWD with openocd's stm32g0x target, or the ROM bootloader over USART2 with stm32flash. */
export const STM32_FLASHING = [
  "SWD (Debian package openocd), probe on SWDIO pin 18, SWCLK pin 19, NRST pin 6, GND pin 5, target powered:",
  'make flash   (runs: openocd -f interface/stlink.cfg -f target/stm32g0x.cfg -c "program build/firmware.elf verify reset exit"; use your probe\'s interface file)',
  "Or the ROM bootloader over the serial line (Debian package stm32flash), a 3.3 V USB-serial adapter on PA2 pin 9 (TX) and PA3 pin 10 (RX); a blank part starts its bootloader by itself:",
  "stm32flash -w firmware/firmware.bin -v -S 0x08000000 /dev/ttyUSB0",
  "Then power-cycle or pulse NRST and check the output against CHECKLIST.md.",
];

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
  const clock = stmClock(plan);
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
      clock: { ...clock, hsiDivisor: clock.kind === "hsisys" ? 2 ** clock.hsidiv : 1 },
      part: STM32_PART,
    },
    flashing: STM32_FLASHING,
  };
}
