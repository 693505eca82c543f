// Registry of the supported devices and their public descriptions.
import type { DeviceInfo } from "../plan-types";
import { atmega328p } from "./atmega328p";
import { attiny85 } from "./attiny85";
import { msp430g2553 } from "./msp430g2553";
import { pic12f1840 } from "./pic12f1840";
import { rp2040 } from "./rp2040";
import { timerInfo, type DeviceSpec } from "./spec";
import { stm32g031 } from "./stm32g031";

export const DEVICES: readonly DeviceSpec[] = [
  atmega328p,
  attiny85,
  stm32g031,
  rp2040,
  pic12f1840,
  msp430g2553,
];

export function findDevice(id: string): DeviceSpec | undefined {
  return DEVICES.find((d) => d.id === id.trim().toLowerCase());
}

export function deviceInfo(d: DeviceSpec): DeviceInfo {
  return {
    id: d.id,
    name: d.name,
    family: d.family,
    core: d.core,
    reference: d.reference,
    minClockHz: d.minClockHz,
    maxClockHz: d.maxClockHz,
    clocks: d.clocks.map((c) => ({ ...c })),
    timers: d.timers.map(timerInfo),
    toolchain: { ...d.toolchain },
    ...(d.packages
      ? { packages: d.packages.map((p) => ({ ...p, servicePins: p.servicePins.map((s) => ({ ...s })) })) }
      : {}),
  };
}

export type { DeviceSpec, TimerSpec, TimerConfig } from "./spec";
