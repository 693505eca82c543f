// Request checks: every refusal is a typed EngineError, never a plan.
import { EngineError } from "../errors";
import { DEVICES, findDevice, type DeviceSpec, type TimerSpec } from "../devices";
import type { ClockOption, PlanRequest, TimerMode } from "../plan-types";
import { checkStart, type CheckedStart } from "./start";

export interface CheckedRequest {
  device: DeviceSpec;
  timers: TimerSpec[];
  timerGiven: boolean;
  mode: TimerMode;
  clockHz: number;
  periodS: number;
  highS: number;
  clock: ClockOption;
  clockAccuracyPpm: number;
  activeLow: boolean;
  /** The old stage's active pulse as requested (equals highS unless activeLow). */
  activeS: number;
  /** Package the plan is for (the device's first listed package when omitted). */
  packageName?: string;
  /** start, delayS, edge, retrigger (engine.md section 6); "free" for free-running plans. */
  trigger: CheckedStart;
}

const MODES: readonly TimerMode[] = ["pwm", "toggle", "isr"];

/** Clock cycles the solver counts exactly (totals x 16 divider quanta stay below 2^50). */
export const MAX_PLAN_CYCLES = 2 ** 46;
// The firmware's interrupt counter is 32 bits (isr.ts MAX_SOFTWARE_DIVIDER).
const MAX_SOFTWARE_DIVIDER = 2 ** 32 - 1;

/** Most clock cycles one period can span on this device: largest divider x largest count x software divider, within the exact-count limit. */
export function longestPeriodCycles(device: DeviceSpec): number {
  let most = 0;
  for (const t of device.timers) {
    const isr = t.counts.isr;
    if (isr) most = Math.max(most, t.isrDividers[t.isrDividers.length - 1] * isr.max * MAX_SOFTWARE_DIVIDER);
    for (const mode of ["pwm", "toggle"] as const) {
      const range = t.counts[mode];
      const factors = t.modeFactors[mode];
      if (range && factors)
        most = Math.max(most, t.dividers[t.dividers.length - 1] * Math.max(...factors) * range.max);
    }
  }
  return Math.min(most, MAX_PLAN_CYCLES);
}

/** Longest period any plan on this device can make, at its slowest clock (seconds). */
export function longestPeriodS(device: DeviceSpec): number {
  return longestPeriodCycles(device) / device.minClockHz;
}

/** Longest period any plan on any device can make (seconds): a stage slower than this has no target. */
export const LONGEST_PERIOD_S = Math.max(...DEVICES.map(longestPeriodS));

/**
 * Fewest clock cycles one period can span on this device: a period has a high
 * and a low part, each at least one clock cycle, and no timer counts shorter
 * than its smallest divider x count x mode factor.
 */
export function shortestPeriodCycles(device: DeviceSpec): number {
  let fewest = Infinity;
  for (const t of device.timers) {
    const isr = t.counts.isr;
    if (isr) fewest = Math.min(fewest, t.isrDividers[0] * isr.min);
    for (const mode of ["pwm", "toggle"] as const) {
      const range = t.counts[mode];
      const factors = t.modeFactors[mode];
      if (range && factors) fewest = Math.min(fewest, t.dividers[0] * Math.min(...factors) * range.min);
    }
  }
  return Math.max(2, fewest);
}

/** Shortest period any plan on any device can make (seconds), at each device's fastest clock. */
export const SHORTEST_PERIOD_S = Math.min(...DEVICES.map((d) => shortestPeriodCycles(d) / d.maxClockHz));

/** One clock cycle of the fastest clock of any device (seconds): no plan resolves a shorter time. */
export const SHORTEST_TIME_S = 1 / Math.max(...DEVICES.map((d) => d.maxClockHz));

function positive(value: unknown, field: string): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0)
    throw new EngineError(
      "invalid-request",
      `${field} must be a finite number above zero, got ${String(value)}.`,
      field,
    );
  return value;
}

export function checkRequest(request: PlanRequest): CheckedRequest {
  if (!request || typeof request !== "object")
    throw new EngineError("invalid-request", "A plan request object is required.");
  if (typeof request.device !== "string")
    throw new EngineError("invalid-request", "device must be a device id string.", "device");
  const device = findDevice(request.device);
  if (!device)
    throw new EngineError(
      "unknown-device",
      `Unknown device "${request.device}". Known: ${DEVICES.map((d) => d.id).join(", ")}.`,
      "device",
    );
  const clockHz = positive(request.clockHz, "clockHz");
  const periodS = positive(request.periodS, "periodS");
  if (typeof request.highS !== "number" || !Number.isFinite(request.highS))
    throw new EngineError(
      "invalid-request",
      `highS must be a finite number, got ${String(request.highS)}.`,
      "highS",
    );
  const highS = request.highS;
  if (highS <= 0 || highS >= periodS)
    throw new EngineError(
      "invalid-high-time",
      `High time ${highS} s must be above zero and below the period ${periodS} s.`,
      "highS",
    );
  const mode = request.mode ?? "pwm";
  if (!MODES.includes(mode))
    throw new EngineError(
      "invalid-request",
      `mode must be one of ${MODES.join(", ")}, got ${String(mode)}.`,
      "mode",
    );
  const { clock, packageName } = checkClockChoice(device, request.clockSource, clockHz, request.package);
  // Bounds the solver's work too: every search below counts at most this many cycles.
  const most = longestPeriodCycles(device);
  if (periodS * clockHz > most)
    throw new EngineError(
      "unreachable-period",
      `Period ${periodS} s is ${Number((periodS * clockHz).toPrecision(4))} clock cycles at ${clockHz} Hz; ${device.name} plans can span at most ${Number(most.toPrecision(4))} (${Number((most / clockHz).toPrecision(4))} s at this clock). Use a slower clock.`,
      "periodS",
    );
  let timers = device.timers;
  const timerGiven = request.timer !== undefined && request.timer !== null && request.timer !== "";
  if (timerGiven) {
    const name = String(request.timer).trim().toUpperCase();
    timers = device.timers.filter((t) => t.name === name);
    if (timers.length === 0)
      throw new EngineError(
        "unknown-timer",
        `${device.name} has no timer "${String(request.timer)}". Timers: ${device.timers.map((t) => t.name).join(", ")}.`,
        "timer",
      );
  }
  let clockAccuracyPpm = clock.accuracyPpm;
  if (request.clockAccuracyPpm !== undefined) {
    const a = request.clockAccuracyPpm;
    if (typeof a !== "number" || !Number.isFinite(a) || a < 0)
      throw new EngineError(
        "invalid-request",
        "clockAccuracyPpm must be a finite number >= 0.",
        "clockAccuracyPpm",
      );
    clockAccuracyPpm = a;
  }
  if (request.activeLow !== undefined && typeof request.activeLow !== "boolean")
    throw new EngineError("invalid-request", "activeLow must be true or false.", "activeLow");
  const activeLow = request.activeLow === true;
  // Active low: the pin is low for the active pulse, so its high time is the rest.
  const pinHighS = activeLow ? periodS - highS : highS;
  return {
    device,
    timers,
    timerGiven,
    mode,
    clockHz,
    periodS,
    highS: pinHighS,
    clock,
    clockAccuracyPpm,
    activeLow,
    activeS: highS,
    ...(packageName !== undefined ? { packageName } : {}),
    trigger: checkStart(request, periodS, highS),
  };
}

/**
 * The one rule for whether a device can run at this clock source and
 * frequency on this package. planTarget calls it, and so does the form's and
 * the API's target schema (lib/validation/target.ts), so the browser's live
 * plans and generation refuse the same combinations with the same words.
 */
export function checkClockChoice(
  device: DeviceSpec,
  clockSource: string | undefined,
  clockHz: number,
  pkg?: unknown,
): { clock: ClockOption; packageName?: string } {
  if (clockHz < device.minClockHz || clockHz > device.maxClockHz)
    throw new EngineError(
      "clock-out-of-range",
      `${device.name} runs from ${device.minClockHz} Hz to ${device.maxClockHz} Hz; ${clockHz} Hz is outside.`,
      "clockHz",
    );
  const clockId = clockSource ?? device.defaultClock;
  const clock = device.clocks.find((c) => c.id === clockId);
  if (!clock)
    throw new EngineError(
      "invalid-request",
      `${device.name} has no clock option "${clockId}". Options: ${device.clocks.map((c) => c.id).join(", ")}.`,
      "clockSource",
    );
  const packageName = checkPackage(device, pkg);
  if (packageName !== undefined && clock.packages && !clock.packages.includes(packageName))
    throw new EngineError(
      "invalid-request",
      `${device.name}: ${clock.label} cannot run on the ${packageName} package; it needs ${clock.packages.join(" or ")}.`,
      "clockSource",
    );
  // A source with discrete frequencies (a PLL from a fixed crystal, IRCF steps)
  // runs only at those: refuse any other before a plan or a bundle is made.
  if (clock.frequenciesHz && !clockMakes(clock, clockHz)) {
    const others = device.clocks.filter(
      (c) => c.id !== clock.id && (c.frequenciesHz ? clockMakes(c, clockHz) : c.hz === clockHz),
    );
    const near = [...clock.frequenciesHz]
      .sort((a, b) => Math.abs(a - clockHz) - Math.abs(b - clockHz) || a - b)
      .slice(0, 2)
      .sort((a, b) => a - b);
    throw new EngineError(
      "clock-out-of-range",
      `Clock frequency ${clockHz} Hz: ${device.name} ${clock.label} cannot make ${clockHz} Hz; nearest it makes: ${near.join(" Hz, ")} Hz` +
        (others.length ? `; ${clockHz} Hz is clock source ${others.map((c) => c.id).join(", ")}.` : "."),
      "clockHz",
    );
  }
  // Opt-in per device until every device's options state ranges that the solver tests respect.
  if (
    device.strictClockRange === true &&
    ((clock.minHz !== undefined && clockHz < clock.minHz * (1 - 1e-9)) ||
      (clock.maxHz !== undefined && clockHz > clock.maxHz * (1 + 1e-9)))
  )
    throw new EngineError(
      "clock-out-of-range",
      `${device.name} clock option ${clock.id} runs from ${clock.minHz ?? device.minClockHz} Hz to ${clock.maxHz ?? device.maxClockHz} Hz; ${clockHz} Hz is outside.`,
      "clockHz",
    );
  device.checkClock?.(clock, clockHz, packageName ?? "");
  return { clock, ...(packageName !== undefined ? { packageName } : {}) };
}

/** The requested package, checked against the device's list; the first listed when omitted. */
function checkPackage(device: DeviceSpec, requested: unknown): string | undefined {
  const names = (device.packages ?? []).map((p) => p.name);
  if (requested === undefined || requested === null || requested === "") return names[0];
  if (typeof requested !== "string" || !names.includes(requested.trim()))
    throw new EngineError(
      "invalid-request",
      names.length > 0
        ? `${device.name} has no package "${String(requested)}". Packages: ${names.join(", ")}.`
        : `${device.name} lists no packages, so package must be left out.`,
      "package",
    );
  return requested.trim();
}

/** Whether a discrete clock source makes this frequency (to a part in 10^9); sources without steps make any. The form's schema uses the same rule. */
export function clockMakes(clock: Pick<ClockOption, "frequenciesHz">, hz: number): boolean {
  return !clock.frequenciesHz || clock.frequenciesHz.some((f) => Math.abs(f - hz) <= f * 1e-9);
}
