// Which emulator runs which device: one line per device id (the engine's
// device table). A device without a line answers not-emulated, never a guess.
// Each wrapper is a DeviceEmulator (types.ts) in its own file of this folder.
import { AVR_IMAGE, emulateAvr } from "./avr";
import { emulateMsp430g2553, MSP430G2553_IMAGE } from "./msp430g2553";
import { emulatePic12f1840, PIC12F1840_IMAGE } from "./pic12f1840";
import { emulateRp2040, RP2040_IMAGE } from "./rp2040";
import { emulateStm32g031, STM32G031_IMAGE } from "./stm32g031";
import { notEmulated } from "./switches";
import type { DeviceEmulator, EmulationInput, EmulationResult } from "./types";

/** Each line: the wrapper and the image it runs (the same constant the wrapper reads, so the two cannot drift). */
export const DEVICE_EMULATORS: Record<string, { run: DeviceEmulator; image: string }> = {
  atmega328p: { run: emulateAvr, image: AVR_IMAGE },
  attiny85: { run: emulateAvr, image: AVR_IMAGE },
  rp2040: { run: emulateRp2040, image: RP2040_IMAGE },
  stm32g031: { run: emulateStm32g031, image: STM32G031_IMAGE },
  msp430g2553: { run: emulateMsp430g2553, image: MSP430G2553_IMAGE },
  pic12f1840: { run: emulatePic12f1840, image: PIC12F1840_IMAGE },
};

/** The image the device's emulator runs, inside the target folder ("firmware/firmware.elf"), or null. */
export function runImageOf(device: string): string | null {
  return DEVICE_EMULATORS[device]?.image ?? null;
}

/** Runs the device's emulator; a wrapper that throws is reported as not-emulated with its message. */
export async function emulateTarget(input: EmulationInput): Promise<EmulationResult> {
  const entry = DEVICE_EMULATORS[input.device];
  if (!entry) return notEmulated(`No emulator wired for ${input.device}.`);
  try {
    return await entry.run(input);
  } catch (e) {
    return notEmulated(`The emulator run stopped with an error: ${(e as Error).message}`);
  }
}

export type { DeviceEmulator, EmulationInput, EmulationResult, EmulationVerdict } from "./types";
