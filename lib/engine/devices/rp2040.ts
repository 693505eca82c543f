// RP2040. Reference: RP2040 datasheet (Raspberry Pi Ltd), chapter 4.5 PWM
// (CSR EN/PH_CORRECT, DIV 8.4 fixed point, TOP, CC, INTE; period formula with
// the fractional divider and phase-correct mode), GPIO function table
// (FUNCSEL 4 = PWM) and the QFN-56 pinout.
import type { PinAssignment } from "../plan-types";
import { pin, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";

// DIV_INT 1..255 and DIV_FRAC 0..15: divider = DIV_INT + DIV_FRAC/16.
const DIVIDERS = Array.from({ length: 255 * 16 - 15 }, (_, i) => (16 + i) / 16);
const INT_DIVIDERS = Array.from({ length: 255 }, (_, i) => i + 1);

// QFN-56: GPIO0..7 on pins 2..9, GPIO8..15 on pins 11..18 (from memory).
function qfnPin(gpio: number): number {
  return gpio < 8 ? gpio + 2 : gpio + 3;
}

function slice(n: number): TimerSpec {
  const gpio = 2 * n; // channel A of slice n: slice = (gpio >> 1) & 7, channel = gpio & 1
  const out: PinAssignment = pin({
    port: `GPIO${gpio}`,
    function: `PWM${n}_A`,
    packagePin: qfnPin(gpio),
    package: "QFN-56",
    portName: "GPIO",
    bit: gpio,
    gpio,
    funcSel: 4,
    slice: (gpio >> 1) & 7,
    channel: (gpio & 1) === 0 ? "A" : "B",
    fromMemory: true,
  });
  return {
    name: `PWM${n}`,
    bits: 16,
    dividers: DIVIDERS,
    isrDividers: INT_DIVIDERS,
    dividerQuantum: 16,
    counts: { pwm: { min: 2, max: 65536 }, isr: { min: 1, max: 65536 } },
    modeFactors: { pwm: [1, 2] },
    highStep: 1,
    pins: { pwm: out, isr: { ...out, function: "GPIO", funcSel: 5 } },
    registers(c: TimerConfig): Record<string, number> {
      const div16 = Math.round(c.divider * 16);
      const DIV = ((div16 >> 4) << 4) | (div16 & 15);
      if (c.mode === "pwm")
        return { CSR: c.modeFactor === 2 ? 0x03 : 0x01, DIV, TOP: c.periodCounts - 1, CC: c.highCounts };
      return { CSR: 0x01, DIV, TOP: c.periodCounts - 1, INTE: 1 << n };
    },
  };
}

export const rp2040: DeviceSpec = {
  id: "rp2040",
  name: "RP2040",
  family: "RP2040 (dual Arm Cortex-M0+)",
  core: "cortex-m0plus",
  reference: "RP2040 datasheet, Raspberry Pi Ltd, PWM chapter",
  minClockHz: 1e6,
  maxClockHz: 133e6,
  clocksPerCpuCycle: 1,
  isrLatencyCycles: 15,
  isrLatencySource: "Cortex-M0+ exception entry, 15 cycles with zero-wait-state memory (from memory)",
  clocks: [
    {
      id: "xosc-pll",
      label: "12 MHz crystal through PLL_SYS (125 MHz default)",
      minHz: 1e6,
      maxHz: 133e6,
      accuracyPpm: 50,
      kind: "crystal",
      accuracySource: "common practice",
    },
    {
      id: "xosc",
      label: "Crystal oscillator 1-15 MHz",
      minHz: 1e6,
      maxHz: 15e6,
      accuracyPpm: 50,
      kind: "crystal",
      accuracySource: "common practice",
    },
    {
      id: "rosc",
      label: "Ring oscillator (about 6 MHz, uncalibrated)",
      minHz: 1e6,
      maxHz: 12e6,
      accuracyPpm: 500000,
      kind: "internal",
      accuracySource: "varies with process, voltage and temperature; from memory",
    },
  ],
  defaultClock: "xosc-pll",
  timers: Array.from({ length: 8 }, (_, n) => slice(n)),
  toolchain: {
    compiler: "arm-none-eabi-gcc",
    target: "-mcpu=cortex-m0plus -mthumb",
    header: "hardware/regs/pwm.h",
  },
};
