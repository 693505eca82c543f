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
  /** start, delayS, edge, retrigger (engine.md section 6); "free" for free-running plans. */
  trigger: CheckedStart;
}

const MODES: readonly TimerMode[] = ["pwm", "toggle", "isr"];

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
  if (clockHz < device.minClockHz || clockHz > device.maxClockHz)
    throw new EngineError(
      "clock-out-of-range",
      `${device.name} runs from ${device.minClockHz} Hz to ${device.maxClockHz} Hz; ${clockHz} Hz is outside.`,
      "clockHz",
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
  const clockId = request.clockSource ?? device.defaultClock;
  const clock = device.clocks.find((c) => c.id === clockId);
  if (!clock)
    throw new EngineError(
      "invalid-request",
      `${device.name} has no clock option "${clockId}". Options: ${device.clocks.map((c) => c.id).join(", ")}.`,
      "clockSource",
    );
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
    trigger: checkStart(request, periodS, highS),
  };
}
