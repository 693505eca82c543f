// Which standard crystal makes a period exact (or best) on a device: plan
// the target at every common crystal frequency inside the device's clock
// range and rank by period error, then high-time error.
import { isEngineError } from "./errors";
import { findDevice } from "./devices";
import { planTarget } from "./solver";
import type { PlanRequest, TimerMode } from "./plan-types";

/** Common crystal frequencies in Hz (engine.md section 3; 32.768 kHz watch crystal added). */
export const COMMON_CRYSTALS_HZ: readonly number[] = [
  32768, 1e6, 1.8432e6, 2e6, 3.579545e6, 3.6864e6, 4e6, 4.9152e6, 6e6, 7.3728e6, 8e6, 10e6, 11.0592e6, 12e6,
  14.7456e6, 16e6, 18.432e6, 20e6, 24e6, 25e6,
];

export interface CrystalSuggestion {
  clockHz: number;
  exact: boolean;
  periodErrorPpm: number;
  highErrorPpm: number;
  timer: string;
  mode: TimerMode;
  divider: number;
  periodCounts: number;
  softwareDivider: number;
}

/** Ranked suggestions; crystals the request cannot be planned at are left out. */
export function suggestCrystals(request: Omit<PlanRequest, "clockHz">): CrystalSuggestion[] {
  const device = findDevice(String(request.device));
  const out: CrystalSuggestion[] = [];
  for (const hz of COMMON_CRYSTALS_HZ) {
    if (device && (hz < device.minClockHz || hz > device.maxClockHz)) continue;
    try {
      // Plan on the device's crystal oscillator where it names one, so a part
      // that takes only some crystals (MSP430 LFXT1: 32.768 kHz) refuses the rest.
      const clockSource = device?.clocks.find((c) => c.kind === "crystal")?.id;
      const p = planTarget({ ...request, clockHz: hz, clockSource } as PlanRequest);
      out.push({
        clockHz: hz,
        exact: p.periodErrorPpm === 0,
        periodErrorPpm: p.periodErrorPpm,
        highErrorPpm: p.highErrorPpm,
        timer: p.timer,
        mode: p.mode,
        divider: p.divider,
        periodCounts: p.periodCounts,
        softwareDivider: p.softwareDivider,
      });
    } catch (e) {
      // An invalid request is invalid at every frequency: report it once. A
      // crystal the clock source cannot run at is left out like an unreachable one.
      if (!isEngineError(e) || (e.code !== "unreachable-period" && e.code !== "clock-out-of-range")) throw e;
    }
  }
  const wanted = request.mode ?? "pwm";
  return out.sort(
    (a, b) =>
      Math.abs(a.periodErrorPpm) - Math.abs(b.periodErrorPpm) ||
      Math.abs(a.highErrorPpm) - Math.abs(b.highErrorPpm) ||
      Number(b.mode === wanted) - Number(a.mode === wanted) ||
      a.clockHz - b.clockHz,
  );
}
