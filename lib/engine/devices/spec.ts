// Internal device description the solver works from. The public view
// (DeviceInfo) is derived from it in ./index.ts.
import type { ClockOption, DeviceId, PackageInfo, PinAssignment, TimerInfo, TimerMode } from "../plan-types";

/** One solved configuration, in the units the registers use. */
export interface TimerConfig {
  mode: TimerMode;
  /** Effective divider in clock cycles per count (RP2040 fractional). */
  divider: number;
  periodCounts: number;
  modeFactor: 1 | 2;
  softwareDivider: number;
  highCounts: number;
}

export interface CountRange {
  min: number;
  max: number;
}

export interface TimerSpec {
  name: string;
  bits: number;
  /** Effective dividers, ascending. */
  dividers: readonly number[];
  /** Dividers allowed for interrupt plans (RP2040: integers only, so intervals do not jitter). */
  isrDividers: readonly number[];
  /** Divider quantum: every divider times this is an integer (16 for the RP2040 8.4 divider). */
  dividerQuantum: number;
  counts: Partial<Record<TimerMode, CountRange>>;
  /** Mode factors tried per hardware mode (RP2040 pwm: 1 edge-aligned, 2 phase-correct). */
  modeFactors: Partial<Record<"pwm" | "toggle", readonly (1 | 2)[]>>;
  /** pwm high-time step in counts (PIC 10-bit duty: 0.25). */
  highStep: number;
  pins: Partial<Record<TimerMode, PinAssignment>>;
  /** Register values; `clock` is the chosen clock option where the timer's clock select depends on it (MSP430 TASSEL). */
  registers(config: TimerConfig, clock?: ClockOption): Record<string, number>;
  /** Facts to repeat in every plan on this timer. */
  notes?: (config: TimerConfig) => string[];
}

export interface DeviceSpec {
  id: DeviceId;
  name: string;
  family: string;
  core: "avr" | "cortex-m0plus" | "pic" | "msp430";
  reference: string;
  minClockHz: number;
  maxClockHz: number;
  /** Clock cycles per CPU instruction cycle (PIC: Fosc/4), for the 500-cycle interrupt rule. */
  clocksPerCpuCycle: number;
  /** Worst interrupt entry latency in clock cycles, reported as isr jitter. */
  isrLatencyCycles: number;
  isrLatencySource: string;
  clocks: ClockOption[];
  defaultClock: string;
  /** Refuse a clockHz outside the chosen clock option's minHz..maxHz (EngineError on clockHz) instead of planning it. */
  strictClockRange?: boolean;
  timers: TimerSpec[];
  toolchain: { compiler: string; target: string; header: string };
  /** Packages, the default first, with their service pins (supply, ground, reset, crystal, programming). */
  packages?: PackageInfo[];
  /**
   * Device-specific clock check run after the generic ones: throws an
   * EngineError naming clockSource, clockHz or package when this source
   * cannot make clockHz on this package.
   */
  checkClock?: (clock: ClockOption, clockHz: number, packageName: string) => void;
}

export function timerInfo(t: TimerSpec): TimerInfo {
  const modes = (["pwm", "toggle", "isr"] as const).filter((m) => t.counts[m]);
  const quantized = t.dividerQuantum > 1;
  const all = Object.values(t.counts) as CountRange[];
  const pins: PinAssignment[] = [];
  for (const m of modes) {
    const p = t.pins[m];
    if (p && !pins.some((q) => q.port === p.port && q.function === p.function)) pins.push(p);
  }
  return {
    name: t.name,
    bits: t.bits,
    dividers: quantized
      ? { min: t.dividers[0], max: t.dividers[t.dividers.length - 1], step: 1 / t.dividerQuantum }
      : t.dividers.length > 64
        ? { min: t.dividers[0], max: t.dividers[t.dividers.length - 1], step: 1 }
        : [...t.dividers],
    minCounts: Math.min(...all.map((r) => r.min)),
    maxCounts: Math.max(...all.map((r) => r.max)),
    modes,
    pins,
  };
}

/** Integer range [from, to] as an array. */
export function range(from: number, to: number, step = 1): number[] {
  const out: number[] = [];
  for (let v = from; v <= to + 1e-12; v += step) out.push(v);
  return out;
}

export function pin(p: Omit<PinAssignment, "fromMemory"> & { fromMemory?: boolean }): PinAssignment {
  return { ...p, fromMemory: p.fromMemory ?? false };
}
