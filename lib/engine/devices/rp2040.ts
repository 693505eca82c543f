// RP2040. Reference: RP2040 datasheet (Raspberry Pi Ltd), chapter 4.5 PWM
// (CSR EN/PH_CORRECT, DIV 8.4 fixed point, TOP, CC, INTE; period formula with
// the fractional divider and phase-correct mode), GPIO function table
// (FUNCSEL 4 = PWM), the QFN-56 pin list (pin locations) and, for the clock
// sources, ./rp2040-clocks.ts.
import type { PackageInfo, PinAssignment } from "../plan-types";
import { RP2040_MAX_SYS_HZ, RP2040_PLL_FREQUENCIES_HZ, RP2040_XOSC_HZ } from "./rp2040-clocks";
import { pin, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";

// DIV_INT 1..255 and DIV_FRAC 0..15: divider = DIV_INT + DIV_FRAC/16.
const DIVIDERS = Array.from({ length: 255 * 16 }, (_, i) => (16 + i) / 16); // 1.0 .. 255.9375
const INT_DIVIDERS = Array.from({ length: 255 }, (_, i) => i + 1);

// QFN-56: GPIO0..7 on pins 2..9, GPIO8..15 on pins 11..18 (RP2040 datasheet,
// pin locations; recalled and checked against a public pin table that cites it).
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
    fromMemory: false,
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

// Service pins of the QFN-56 (RP2040 datasheet, pin locations and pin
// descriptions; the hardware design guide's minimal board for the notes).
// Numbers recalled and checked against a public pin table citing the
// datasheet; marked checked.
const QFN56: PackageInfo = {
  name: "QFN-56",
  servicePins: [
    {
      signal: "IOVDD",
      role: "supply",
      packagePins: [1, 10, 22, 33, 42, 49],
      notes: "IO supply 1.8..3.3 V; 100 nF to GND at each pin",
    },
    {
      signal: "DVDD",
      role: "supply",
      packagePins: [23, 50],
      notes: "1.1 V core supply, normally from VREG_VOUT; 100 nF at each pin",
    },
    {
      signal: "VREG_VIN",
      role: "supply",
      packagePins: [44],
      notes: "on-chip core regulator input 1.8..3.3 V; 1 uF to GND",
    },
    {
      signal: "VREG_VOUT",
      role: "supply",
      packagePins: [45],
      notes: "core regulator output 1.1 V; 1 uF to GND, wire to DVDD",
    },
    {
      signal: "USB_VDD",
      role: "supply",
      packagePins: [48],
      notes: "USB PHY supply 3.3 V (needed for the BOOTSEL USB drive); 100 nF",
    },
    {
      signal: "ADC_AVDD",
      role: "supply",
      packagePins: [43],
      notes: "ADC supply 1.8..3.3 V, tie to IOVDD when the ADC is unused; 100 nF",
    },
    {
      signal: "GND",
      role: "ground",
      packagePins: [57],
      notes: "exposed centre pad is the only ground: solder it",
    },
    {
      signal: "RUN",
      role: "reset",
      packagePins: [26],
      notes: "active-low reset with internal pull-up; a push button to GND restarts the chip",
    },
    {
      signal: "XIN",
      role: "crystal",
      packagePins: [20],
      notes: "12 MHz crystal with load capacitors to GND",
    },
    {
      signal: "XOUT",
      role: "crystal",
      packagePins: [21],
      notes: "12 MHz crystal; the board's usual series resistor (about 1 kOhm) on this side",
    },
    {
      signal: "SWCLK",
      role: "programming",
      packagePins: [24],
      notes: "SWD header clock (openocd, target rp2040)",
    },
    { signal: "SWD", role: "programming", packagePins: [25], notes: "SWD header data (SWDIO)" },
    {
      signal: "QSPI_SS",
      role: "boot",
      packagePins: [56],
      notes: "flash chip select; pulled to GND through a button (BOOTSEL) at reset enters the USB drive",
    },
    {
      signal: "QSPI_SCLK",
      role: "boot",
      packagePins: [52],
      notes: "QSPI flash clock",
    },
    {
      signal: "QSPI_SD0..SD3",
      role: "boot",
      packagePins: [53, 55, 54, 51],
      notes: "QSPI flash data lines SD0, SD1, SD2, SD3",
    },
    { signal: "TESTEN", role: "ground", packagePins: [19], notes: "factory test enable: tie to GND" },
  ],
};

export const rp2040: DeviceSpec = {
  id: "rp2040",
  name: "RP2040",
  family: "RP2040 (dual Arm Cortex-M0+)",
  core: "cortex-m0plus",
  reference: "RP2040 datasheet, Raspberry Pi Ltd, PWM chapter",
  minClockHz: RP2040_XOSC_HZ,
  maxClockHz: RP2040_MAX_SYS_HZ,
  clocksPerCpuCycle: 1,
  isrLatencyCycles: 15,
  isrLatencySource: "Cortex-M0+ exception entry, 15 cycles with zero-wait-state memory (from memory)",
  clocks: [
    {
      id: "xosc",
      label: "12 MHz crystal direct (XOSC)",
      hz: RP2040_XOSC_HZ,
      frequenciesHz: [RP2040_XOSC_HZ],
      accuracyPpm: 50,
      kind: "crystal",
      accuracySource: "common practice",
    },
    {
      id: "xosc-pll",
      label: "12 MHz crystal through PLL_SYS (frequencies the PLL makes exactly)",
      minHz: RP2040_PLL_FREQUENCIES_HZ[0],
      maxHz: RP2040_MAX_SYS_HZ,
      frequenciesHz: [...RP2040_PLL_FREQUENCIES_HZ],
      accuracyPpm: 50,
      kind: "pll",
      accuracySource: "common practice (the crystal's; the integer PLL adds no frequency error)",
    },
  ],
  // Requests without clockSource are planned on the PLL (125 MHz is the usual
  // clk_sys); the form's new target starts on the first option, 12 MHz direct.
  defaultClock: "xosc-pll",
  timers: Array.from({ length: 8 }, (_, n) => slice(n)),
  toolchain: {
    compiler: "arm-none-eabi-gcc",
    target: "-mcpu=cortex-m0plus -mthumb",
    header: "hardware/regs/pwm.h",
  },
  packages: [QFN56],
};
