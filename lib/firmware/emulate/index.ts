// Which emulator runs which device: one line per device id (the engine's
// device table). A device without a line answers not-emulated, never a guess.
// Each wrapper is a DeviceEmulator (types.ts) in its own file of this folder.
import { emulateAvr } from "./avr";
import { emulateMsp430g2553 } from "./msp430g2553";
import { emulatePic12f1840 } from "./pic12f1840";
import { emulateRp2040 } from "./rp2040";
import { emulateStm32g031 } from "./stm32g031";
import { notEmulated } from "./switches";
import type { DeviceEmulator, EmulationInput, EmulationResult } from "./types";

export const DEVICE_EMULATORS: Record<string, DeviceEmulator> = {
  atmega328p: emulateAvr,
  attiny85: emulateAvr,
  rp2040: emulateRp2040,
  stm32g031: emulateStm32g031,
  msp430g2553: emulateMsp430g2553,
  pic12f1840: emulatePic12f1840,
};

/** Runs the device's emulator; a wrapper that throws is reported as not-emulated with its message. */
export async function emulateTarget(input: EmulationInput): Promise<EmulationResult> {
  const emulate = DEVICE_EMULATORS[input.device];
  if (!emulate) return notEmulated(`No emulator wired for ${input.device}.`);
  try {
    return await emulate(input);
  } catch (e) {
    return notEmulated(`The emulator run stopped with an error: ${(e as Error).message}`);
  }
}

export type { DeviceEmulator, EmulationInput, EmulationResult, EmulationVerdict } from "./types";
