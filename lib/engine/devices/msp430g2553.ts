// MSP430G2553. Reference: MSP430x2xx Family User's Guide (TI SLAU144),
// Timer_A chapter (TACTL TASSEL/ID/MC, TACCTLx OUTMOD, up mode period
// TACCR0+1) and Basic Clock Module+ chapter (LFXT1 modes, DCO calibration),
// and the MSP430G2x53 datasheet (TI SLAS735) for the 20-pin PDIP pinout,
// P1.2 = TA0.1 (P1SEL = 1, P1SEL2 = 0), the calibrated DCO and LFXT1 limits.
import type { ClockOption } from "../plan-types";
import { pin, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";

const ID: Record<number, number> = { 1: 0, 2: 1, 4: 2, 8: 3 };
const P12 = { port: "P1.2", packagePin: 4, package: "PDIP-20", portName: "1", bit: 2 };

/** The DCO frequencies the G2553 stores calibration bytes for (CALBC1_xMHZ / CALDCO_xMHZ, SLAS735). */
export const MSP430_CALIBRATED_HZ = [1e6, 8e6, 12e6, 16e6] as const;

/** Timer_A clock select for a clock option: SMCLK (TASSEL_2) from the DCO, ACLK (TASSEL_1) from LFXT1. */
export function msp430Tassel(clockId: string | undefined): 1 | 2 {
  return clockId === "lfxt1" || clockId === "external" ? 1 : 2;
}

const timerA0: TimerSpec = {
  name: "TIMER0_A3",
  bits: 16,
  dividers: [1, 2, 4, 8],
  isrDividers: [1, 2, 4, 8],
  dividerQuantum: 1,
  counts: { pwm: { min: 2, max: 65536 }, toggle: { min: 1, max: 65536 }, isr: { min: 1, max: 65536 } },
  modeFactors: { pwm: [1], toggle: [2] },
  highStep: 1,
  pins: {
    pwm: pin({ ...P12, function: "TA0.1", sel: 1, sel2: 0 }),
    toggle: pin({ ...P12, function: "TA0.1", sel: 1, sel2: 0 }),
    isr: pin({ ...P12, function: "GPIO", sel: 0, sel2: 0 }),
  },
  registers(c: TimerConfig, clock?: ClockOption): Record<string, number> {
    // TACTL: TASSEL 9..8 (1 = ACLK, 2 = SMCLK), ID 7..6, MC 5..4 (1 = up). TACCTLx: OUTMOD 7..5, CCIE 4.
    const tactl = (msp430Tassel(clock?.id) << 8) | (ID[c.divider] << 6) | (1 << 4);
    const n = c.periodCounts;
    if (c.mode === "pwm") return { TACTL: tactl, TACCR0: n - 1, TACCR1: c.highCounts, TACCTL1: 7 << 5 };
    // toggle: TA0.1 toggles when TAR reaches TACCR1 = TACCR0, once per timer period
    if (c.mode === "toggle") return { TACTL: tactl, TACCR0: n - 1, TACCR1: n - 1, TACCTL1: 4 << 5 };
    return { TACTL: tactl, TACCR0: n - 1, TACCTL0: 1 << 4 };
  },
};

export const msp430g2553: DeviceSpec = {
  id: "msp430g2553",
  name: "MSP430G2553",
  family: "MSP430 (Value Line)",
  core: "msp430",
  reference: "MSP430x2xx Family User's Guide (SLAU144); MSP430G2x53 datasheet (SLAS735)",
  minClockHz: 10e3,
  maxClockHz: 16e6,
  clocksPerCpuCycle: 1,
  // Interrupt acceptance 6 cycles after the current instruction (up to 6 cycles) (from memory).
  isrLatencyCycles: 12,
  isrLatencySource: "family guide interrupt acceptance, 6 cycles + longest instruction (from memory)",
  clocks: [
    {
      id: "dco-cal",
      label: "DCO with its factory calibration (1, 8, 12 or 16 MHz)",
      minHz: 1e6,
      maxHz: 16e6,
      frequenciesHz: [...MSP430_CALIBRATED_HZ],
      accuracyPpm: 30000,
      kind: "internal",
      accuracySource:
        "SLAS735 calibrated DCO tolerance over temperature (0 to 85 °C, 3 V): +-3 % (from memory; wider over the full supply and temperature range)",
    },
    {
      id: "lfxt1",
      label: "LFXT1 with a 32.768 kHz watch crystal on XIN/XOUT (P2.6/P2.7)",
      hz: 32768,
      minHz: 32768,
      maxHz: 32768,
      accuracyPpm: 20,
      kind: "crystal",
      accuracySource: "typical watch crystal at 25 °C (common practice, no source)",
    },
    {
      // SLAS735: LFXT1 takes a logic-level square wave on XIN in LF mode only
      // (XTS = 0, LFXT1S = 3), 10 kHz to 50 kHz (from memory). The G2xx3 has no
      // LFXT1 high-frequency mode, so a faster external clock is refused.
      id: "external",
      label: "External digital clock into XIN (P2.6), 10 to 50 kHz",
      minHz: 10e3,
      maxHz: 50e3,
      accuracyPpm: 50,
      kind: "external",
      accuracySource:
        "the source's own; 50 ppm assumed for a crystal-controlled source (common practice, no source)",
    },
  ],
  defaultClock: "dco-cal",
  // The bundle has code for exactly these sources and ranges; anything else is refused, never replaced.
  strictClockRange: true,
  timers: [timerA0],
  toolchain: { compiler: "clang --target=msp430 + ld.lld", target: "-mmcu=msp430g2553", header: "msp430.h" },
  // SLAS735 pin designation, 20-pin N (PDIP) package.
  packages: [
    {
      name: "PDIP-20",
      servicePins: [
        {
          signal: "DVCC",
          role: "supply",
          packagePins: [1],
          notes: "1.8 V to 3.6 V; 100 nF to DVSS at the pin",
        },
        {
          signal: "DVSS",
          role: "ground",
          packagePins: [20],
          notes: "board ground, common with the old stage",
        },
        {
          signal: "RST/NMI/SBWTDIO",
          role: "reset",
          packagePins: [16],
          notes:
            "47 kΩ pull-up to DVCC and at most 2.2 nF to DVSS, so Spy-Bi-Wire still works; SBWTDIO of the programming header",
        },
        {
          signal: "TEST/SBWTCK",
          role: "programming",
          packagePins: [17],
          notes: "SBWTCK of the programming header (LaunchPad debugger side); leave open in the field",
        },
        {
          signal: "XIN",
          role: "crystal",
          port: "P2.6",
          packagePins: [19],
          notes: "LFXT1 32.768 kHz watch crystal to XOUT, or the external digital clock input",
        },
        {
          signal: "XOUT",
          role: "crystal",
          port: "P2.7",
          packagePins: [18],
          notes: "other side of the watch crystal; open with an external clock into XIN",
        },
      ],
    },
  ],
};
