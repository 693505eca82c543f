// What the bundle can build beyond what the engine can plan. Free of Node and
// template imports so the browser's live plans (lib/revisions/plan-targets.ts)
// and generation (build.ts planAll) apply the one rule.
import { listDevices } from "@/lib/engine";

/** Devices whose templates make triggered and zero-cross firmware. */
export const TRIGGER_DEVICES: ReadonlySet<string> = new Set([
  "atmega328p",
  "attiny85",
  "rp2040",
  "stm32g031",
  "pic12f1840",
  "msp430g2553",
]);

const NAMES = new Map<string, string>(listDevices().map((d) => [d.id, d.name]));

/** Why this plan cannot be built into firmware, naming the target field; null when it can. */
export function buildRefusal(plan: {
  device: string;
  start?: string;
}): { field: string; message: string } | null {
  const start = plan.start;
  // Triggered and zero-cross firmware exists for some devices only; elsewhere
  // such a plan must never be shipped as a free-running image.
  if (start === undefined || start === "free" || TRIGGER_DEVICES.has(plan.device)) return null;
  const name = NAMES.get(plan.device) ?? plan.device;
  return {
    field: "start",
    message: `no firmware for triggered starts on ${name} yet (start "${start}"); plan it free-running or use one of: ${[...TRIGGER_DEVICES].map((d) => NAMES.get(d) ?? d).join(", ")}.`,
  };
}
