// PIC12F1840. Reference: PIC12(L)F1840 datasheet (Microchip DS40001441):
// Timer2 (T2CON, PR2, prescale 1:1/1:4/1:16/1:64), CCP1 PWM mode (period
// (PR2+1)*4*Tosc*prescale, 10-bit duty CCPR1L:DC1B, pulse = DC*Tosc*prescale),
// 8-pin PDIP pin diagram, oscillator module, interrupt latency.
import { pin, type DeviceSpec, type TimerConfig, type TimerSpec } from "./spec";

const PRESCALE: Record<number, number> = { 1: 0, 4: 1, 16: 2, 64: 3 };
// Timer2 counts at Fosc/4 / prescale: the effective divider is 4 * prescale.
const DIVIDERS = [4, 16, 64, 256];
// CCP1/P1A on RA2 (APFCON CCP1SEL = 0), 8-pin PDIP pin 5.
const RA2 = { port: "RA2", packagePin: 5, package: "PDIP-8", portName: "A", bit: 2 };

const timer2: TimerSpec = {
  name: "TIMER2",
  bits: 8,
  dividers: DIVIDERS,
  isrDividers: DIVIDERS,
  dividerQuantum: 1,
  counts: { pwm: { min: 1, max: 256 }, isr: { min: 1, max: 256 } },
  modeFactors: { pwm: [1] },
  // 10-bit duty: two extra bits below PR2, a quarter of a Timer2 count.
  highStep: 0.25,
  pins: { pwm: pin({ ...RA2, function: "CCP1" }), isr: pin({ ...RA2, function: "GPIO" }) },
  registers(c: TimerConfig): Record<string, number> {
    // T2CON: TMR2ON 2, T2CKPS1:0 1..0. CCP1CON: DC1B1:0 5..4, CCP1M3:0 = 1100 (PWM, P1A active high).
    const t2con = (1 << 2) | PRESCALE[c.divider / 4];
    if (c.mode === "pwm") {
      const dc = Math.round(c.highCounts * 4);
      return { T2CON: t2con, PR2: c.periodCounts - 1, CCPR1L: dc >> 2, CCP1CON: 0x0c | ((dc & 3) << 4) };
    }
    // PIE1: TMR2IE 1. INTCON: GIE 7, PEIE 6.
    return { T2CON: t2con, PR2: c.periodCounts - 1, PIE1: 1 << 1, INTCON: 0xc0 };
  },
};

export const pic12f1840: DeviceSpec = {
  id: "pic12f1840",
  name: "PIC12F1840",
  family: "PIC12 (enhanced mid-range)",
  core: "pic",
  reference: "PIC12(L)F1840 datasheet, Microchip DS40001441",
  minClockHz: 31e3,
  maxClockHz: 32e6,
  clocksPerCpuCycle: 4,
  // Interrupt latency 3 to 5 instruction cycles (from memory).
  isrLatencyCycles: 20,
  isrLatencySource: "datasheet interrupt latency, 3-5 instruction cycles (from memory)",
  // Oscillator module, DS40001441 section 5: FOSC<2:0> in CONFIG1 picks LP/XT/HS
  // (crystal on OSC1/RA5 and OSC2/RA4), ECL/ECM/ECH (clock into CLKIN/RA5) or
  // INTOSC; with INTOSC, OSCCON IRCF<3:0> picks one of the discrete internal
  // frequencies below (Register 5-1, from memory) and SPLLEN the 4x PLL
  // (8 MHz IRCF only, 32 MHz). Nothing in between exists, so the engine
  // refuses any other internal frequency (frequenciesHz).
  clocks: [
    {
      id: "crystal",
      label: "Crystal on RA5/RA4, 32 kHz-20 MHz (LP, XT or HS by frequency)",
      minHz: 32e3,
      maxHz: 20e6,
      accuracyPpm: 50,
      kind: "crystal",
      accuracySource: "common practice",
      packages: ["PDIP-8"],
    },
    {
      id: "crystal-pll",
      label: "Crystal 4-8 MHz on RA5/RA4 with the 4x PLL (HS, PLLEN), 16-32 MHz",
      minHz: 16e6,
      maxHz: 32e6,
      accuracyPpm: 50,
      kind: "pll",
      accuracySource: "common practice",
      packages: ["PDIP-8"],
    },
    {
      id: "external",
      label: "External clock into CLKIN (RA5), up to 32 MHz (ECL, ECM or ECH by frequency)",
      minHz: 1e3,
      maxHz: 32e6,
      accuracyPpm: 50,
      kind: "external",
      accuracySource: "that of the clock source; 50 ppm assumed (common practice)",
    },
    {
      id: "hfintosc",
      label: "Internal oscillator, 31.25 kHz to 16 MHz in IRCF steps",
      minHz: 31.25e3,
      maxHz: 16e6,
      frequenciesHz: [31.25e3, 62.5e3, 125e3, 250e3, 500e3, 1e6, 2e6, 4e6, 8e6, 16e6],
      accuracyPpm: 20000,
      kind: "internal",
      accuracySource: "+-2 %, from memory",
    },
    {
      id: "hfintosc-pll",
      label: "Internal oscillator 8 MHz with the 4x PLL (SPLLEN), 32 MHz",
      hz: 32e6,
      frequenciesHz: [32e6],
      accuracyPpm: 20000,
      kind: "pll",
      accuracySource: "+-2 %, from memory",
    },
    {
      id: "lfintosc",
      label: "LFINTOSC 31 kHz",
      hz: 31e3,
      frequenciesHz: [31e3],
      accuracyPpm: 200000,
      kind: "internal",
      accuracySource: "from memory",
    },
  ],
  defaultClock: "crystal",
  timers: [timer2],
  toolchain: { compiler: "gpasm", target: "p12f1840", header: "p12f1840.inc" },
  // DS40001441 8-pin PDIP/SOIC pin diagram (Figure 1) and pinout table.
  // ICSP header order is Microchip's usual 6-pin one (from memory).
  packages: [
    {
      name: "PDIP-8",
      servicePins: [
        {
          signal: "VDD",
          role: "supply",
          packagePins: [1],
          notes:
            "1.8-5.5 V (LF part) or 2.3-5.5 V (F part); 0.1 uF ceramic to VSS at the pin; ICSP header pin 2",
        },
        { signal: "VSS", role: "ground", packagePins: [8], notes: "ground; ICSP header pin 3" },
        {
          signal: "MCLR/VPP",
          role: "reset",
          port: "RA3",
          packagePins: [4],
          notes:
            "MCLRE = 1: reset input, needs a 10 kOhm pull-up to VDD (the weak pull-up is not enough near noise); ICSP header pin 1 (VPP)",
        },
        {
          signal: "ICSPDAT",
          role: "programming",
          port: "RA0",
          packagePins: [7],
          notes: "ICSP data; ICSP header pin 4; keep loads on it light",
        },
        {
          signal: "ICSPCLK",
          role: "programming",
          port: "RA1",
          packagePins: [6],
          notes: "ICSP clock; ICSP header pin 5; keep loads on it light",
        },
        {
          signal: "OSC1/CLKIN",
          role: "crystal",
          port: "RA5",
          packagePins: [2],
          notes:
            "only with a crystal (to OSC2, load capacitors to VSS) or an external clock (clock in here); else free",
        },
        {
          signal: "OSC2/CLKOUT",
          role: "crystal",
          port: "RA4",
          packagePins: [3],
          notes:
            "only with a crystal (to OSC1, load capacitors to VSS); free with an external clock or the internal oscillator",
        },
      ],
    },
  ],
};
