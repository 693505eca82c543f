// The MSP430G2553 clock an image sets up, decoded from its IO writes in the
// simulator. mspdebug's simulator has no Basic Clock Module: it counts SMCLK
// cycles (and an ACLK at a fixed fraction of them) whatever the registers
// say, so the frequency behind those counts is read from what the image
// wrote. Register addresses and fields: MSP430G2x53 datasheet SLAS735
// (peripheral file map, calibration data at 0x10F8..0x10FF) and SLAU144
// (Basic Clock Module+: BCSCTL1 DIVA bits 5:4, XTS bit 6; BCSCTL2 SELS bit 3,
// DIVS bits 2:1; BCSCTL3 LFXT1S bits 5:4; Timer_A TACTL TASSEL bits 9:8,
// ID bits 7:6, MC bits 5:4).
import { SIM_CALIBRATION, lastWrite, type IoWrite } from "./mspdebug-sim";

export const MSP430_REG = {
  WDTCTL: 0x120,
  DCOCTL: 0x56,
  BCSCTL1: 0x57,
  BCSCTL2: 0x58,
  BCSCTL3: 0x53,
  P1DIR: 0x22,
  P1SEL: 0x26,
  P1SEL2: 0x41,
} as const;

/** Calibration slots in information memory, lowest address first: CALDCO/CALBC1 for 16, 12, 8, 1 MHz (SLAS735). */
const CAL_MHZ = [16, 12, 8, 1] as const;
/** A 32.768 kHz watch crystal on LFXT1 (SLAU144: LFXT1S = 00 in LF mode). */
const WATCH_CRYSTAL_HZ = 32768;

export interface Msp430Clocks {
  /** SMCLK and ACLK as the image set them (null when the image leaves them unknown). */
  smclkHz: number | null;
  aclkHz: number | null;
  /** Plain words for the reason, e.g. "calibrated DCO 1 MHz". */
  smclkFrom: string;
  aclkFrom: string;
  problems: string[];
}

/**
 * Clocks from the IO writes. `boardClockHz` is the frequency of a digital
 * clock on XIN (LFXT1S = 11), a board fact the image cannot show; the bundle
 * states it in src/timing.h.
 */
export function msp430Clocks(io: IoWrite[], boardClockHz: number | null): Msp430Clocks {
  const problems: string[] = [];
  const bc1 = lastWrite(io, MSP430_REG.BCSCTL1) ?? 0x87; // reset value (SLAU144, from memory)
  const bc2 = lastWrite(io, MSP430_REG.BCSCTL2) ?? 0;
  const bc3 = lastWrite(io, MSP430_REG.BCSCTL3) ?? 0x05;
  let dcoHz: number | null = null;
  let dcoFrom = "the uncalibrated reset DCO";
  const dcoWrites = io.filter((w) => w.addr === MSP430_REG.DCOCTL || w.addr === MSP430_REG.BCSCTL1);
  const slot = SIM_CALIBRATION.findIndex((b, i) => i % 2 === 1 && b === bc1);
  if (slot > 0) {
    const mhz = CAL_MHZ[(slot - 1) / 2];
    const dco = lastWrite(io, MSP430_REG.DCOCTL);
    if (dco !== SIM_CALIBRATION[slot - 1]) problems.push(`DCOCTL is not the calibration byte for ${mhz} MHz`);
    // Vendor code examples: DCOCTL = 0 before the range changes, so the DCO cannot overshoot.
    const i = dcoWrites.findIndex((w) => w.addr === MSP430_REG.BCSCTL1);
    if (i < 1 || dcoWrites[i - 1].addr !== MSP430_REG.DCOCTL || dcoWrites[i - 1].value !== 0)
      problems.push("BCSCTL1 changed the DCO range without DCOCTL = 0 first");
    dcoHz = mhz * 1e6;
    dcoFrom = `calibrated DCO ${mhz} MHz`;
  }
  const lfxt1s = (bc3 >> 4) & 3;
  let aclkHz: number | null = null;
  let aclkFrom = "LFXT1";
  if ((bc1 & 0x40) !== 0) problems.push("XTS set: the G2553 has no LFXT1 high-frequency mode");
  else if (lfxt1s === 0) {
    aclkHz = WATCH_CRYSTAL_HZ;
    aclkFrom = "LFXT1 32.768 kHz watch crystal";
  } else if (lfxt1s === 3 && boardClockHz) {
    aclkHz = boardClockHz;
    aclkFrom = `the board's digital clock on XIN (${boardClockHz} Hz, from src/timing.h)`;
  } else if (lfxt1s === 2) {
    aclkFrom = "VLOCLK (about 12 kHz, not calibrated)";
  }
  // DIVA (BCSCTL1 bits 5:4) is not applied: the simulator has no clock module, its ACLK ticks at a fixed
  // fraction of SMCLK whatever DIVA says, and a read-modify-write of BCSCTL1 there reads 0xFF (seen:
  // `BCSCTL1 &= ~XTS` wrote 0xBF), so the written DIVA bits say nothing. Generated images leave DIVA at /1.
  // SELS = 1 takes SMCLK from LFXT1/VLO; DIVS divides it.
  const sels = (bc2 >> 3) & 1;
  const divs = 2 ** ((bc2 >> 1) & 3);
  const smclkHz = sels ? (aclkHz === null ? null : aclkHz / divs) : dcoHz === null ? null : dcoHz / divs;
  return {
    smclkHz,
    aclkHz,
    smclkFrom: sels ? aclkFrom : dcoFrom,
    aclkFrom,
    problems,
  };
}
