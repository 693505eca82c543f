// Independent decoders for PIC12F1840 checks (the tests and the emulator
// wrapper lib/firmware/emulate/pic12f1840.ts), written from the
// PIC12(L)F1840 datasheet (Microchip DS40001441) tables, not from the bundle
// code: configuration words (Register 4-1 CONFIG1, Register 4-2 CONFIG2),
// OSCCON (Register 5-1) and the data memory map (bank of each register).
// Bit positions and the IRCF table are as recalled from the datasheet (from
// memory); the configuration bit positions agree with the masks in gputils'
// p12f1840.inc.

export const FOSC_NAMES = ["LP", "XT", "HS", "EXTRC", "INTOSC", "ECL", "ECM", "ECH"] as const;

export interface Config1 {
  fosc: (typeof FOSC_NAMES)[number];
  /** WDTE<1:0>: 00 = watchdog disabled. */
  wdte: number;
  /** PWRTE is active low: true = power-up timer enabled. */
  powerUpTimer: boolean;
  mclrIsReset: boolean;
  codeProtect: boolean;
  dataProtect: boolean;
  /** BOREN<1:0>: 11 = brown-out reset enabled. */
  boren: number;
  /** CLKOUTEN is active low: true = CLKOUT on RA4. */
  clkout: boolean;
  ieso: boolean;
  fcmen: boolean;
}

export function decodeConfig1(w: number): Config1 {
  return {
    fosc: FOSC_NAMES[w & 7],
    wdte: (w >> 3) & 3,
    powerUpTimer: ((w >> 5) & 1) === 0,
    mclrIsReset: ((w >> 6) & 1) === 1,
    codeProtect: ((w >> 7) & 1) === 0,
    dataProtect: ((w >> 8) & 1) === 0,
    boren: (w >> 9) & 3,
    clkout: ((w >> 11) & 1) === 0,
    ieso: ((w >> 12) & 1) === 1,
    fcmen: ((w >> 13) & 1) === 1,
  };
}

export interface Config2 {
  /** WRT<1:0>: 11 = no write protection. */
  wrt: number;
  pllen: boolean;
  stvren: boolean;
  /** BORV: 0 = high trip point. */
  borHigh: boolean;
  lvp: boolean;
}

export function decodeConfig2(w: number): Config2 {
  return {
    wrt: w & 3,
    pllen: ((w >> 8) & 1) === 1,
    stvren: ((w >> 9) & 1) === 1,
    borHigh: ((w >> 10) & 1) === 0,
    lvp: ((w >> 13) & 1) === 1,
  };
}

/** OSCCON IRCF<3:0> -> internal oscillator frequency (Register 5-1; 000x = LFINTOSC 31 kHz). */
export const IRCF_HZ: readonly number[] = [
  31e3, 31e3, 31.25e3, 31.25e3, 62.5e3, 125e3, 250e3, 500e3, 125e3, 250e3, 500e3, 1e6, 2e6, 4e6, 8e6, 16e6,
];

/**
 * The system clock the chip runs at, from its configuration words, OSCCON
 * and the frequency the board supplies on OSC1/CLKIN (crystal or clock).
 * Oscillator module: SCS = 1x selects the internal block; SCS = 00 the FOSC
 * choice; the 4x PLL (PLLEN or SPLLEN) multiplies the 8 MHz HFINTOSC step or
 * the external source.
 */
export function systemClockHz(config1: number, config2: number, osccon: number, boardHz: number): number {
  const fosc = config1 & 7;
  const scs = osccon & 3;
  const pll = (osccon & 0x80) !== 0 || decodeConfig2(config2).pllen;
  if (scs >= 2 || (scs === 0 && FOSC_NAMES[fosc] === "INTOSC")) {
    const ircf = (osccon >> 3) & 15;
    return pll && scs === 0 && ircf === 14 ? 32e6 : IRCF_HZ[ircf];
  }
  if (scs === 1) return 32768; // Timer1 oscillator
  return pll ? boardHz * 4 : boardHz;
}

/**
 * Bank of each special function register the firmware touches (data memory
 * map, DS40001441 Table 3-x; INTCON is a core register present in every bank).
 */
export const REGISTER_BANK: Record<string, number | "all"> = {
  INTCON: "all",
  PORTA: 0,
  PIR1: 0,
  TMR2: 0,
  PR2: 0,
  T2CON: 0,
  TRISA: 1,
  PIE1: 1,
  OSCCON: 1,
  OSCSTAT: 1,
  LATA: 2,
  APFCON: 2,
  ANSELA: 3,
  CCPR1L: 5,
  CCPR1H: 5,
  CCP1CON: 5,
};
