// What a device module hands to its templates: every register write with its
// final value, the C expression in the vendor's bit names, and the formula
// that produced it; plus device facts for the pin map and the Makefile.
import { EngineError } from "@/lib/engine/errors";
import type { BundlePlan } from "./types";

export interface RegisterWrite {
  reg: string;
  value: number;
  /** C expression in the vendor's bit names (equals `value`) */
  expr: string;
  /** the formula and inputs, one line */
  why: string;
}

export interface PinFacts {
  signal: string;
  port: string;
  function: string;
  packagePin: string;
  package: string;
  direction: "output";
  logic: string;
  drive: string;
}

export interface DeviceView {
  /** register writes in the order the code makes them */
  writes: RegisterWrite[];
  pin: PinFacts;
  /** anything else the device's templates read */
  extra: Record<string, unknown>;
  /** How to put the image on the chip: one plain line per step (programmer commands, UF2 copy, SWD). */
  flashing?: string[];
}

export function unsupported(plan: BundlePlan, what: string): never {
  throw new EngineError(
    "invalid-request",
    `${plan.device}: the bundle has no code for ${what} (timer ${plan.timer}, mode ${plan.mode})`,
  );
}

export function intRange(plan: BundlePlan, name: string, value: number, min: number, max: number): number {
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new EngineError(
      "invalid-request",
      `${plan.device}: ${name} = ${value} is outside ${min}..${max} (timer ${plan.timer}, mode ${plan.mode})`,
    );
  }
  return value;
}

export function write(reg: string, value: number, expr: string, why: string): RegisterWrite {
  return { reg, value, expr, why };
}

/** "(1 << A) | (1 << B)" for the set bits, "0" when none. */
export function bits(names: string[]): string {
  return names.length === 0 ? "0" : names.map((n) => `(1 << ${n})`).join(" | ");
}
