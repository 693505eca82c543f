// Public surface of the devices and the timer solver (engine.md sections 2-4).
import { DEVICES, deviceInfo, findDevice } from "./devices";
import { isEngineError } from "./errors";
import { checkClockChoice } from "./solver/validate";
import type { DeviceInfo } from "./plan-types";

export type {
  ClockKind,
  ClockOption,
  DeviceId,
  DeviceInfo,
  InputEdge,
  PinAssignment,
  PlanStart,
  RetriggerRule,
  PlanRequest,
  TimerInfo,
  TimerMode,
  TimerPlan,
} from "./plan-types";
export { planTarget } from "./solver";
export {
  LONGEST_PERIOD_S,
  SHORTEST_PERIOD_S,
  SHORTEST_TIME_S,
  clockMakes,
  longestPeriodS,
} from "./solver/validate";

export function listDevices(): DeviceInfo[] {
  return DEVICES.map(deviceInfo);
}

/**
 * Why this device cannot run at this clock source and frequency (package
 * optional), or null when it can: the same rule planTarget applies, for the
 * form and API schemas, so live plans and generation never disagree.
 */
export function clockChoiceProblem(choice: {
  device: string;
  clockSource?: string;
  clockHz: number;
  package?: string;
}): { field: string; message: string } | null {
  const device = findDevice(choice.device);
  if (!device) return { field: "device", message: `Unknown device "${choice.device}".` };
  try {
    checkClockChoice(device, choice.clockSource, choice.clockHz, choice.package);
    return null;
  } catch (e) {
    if (!isEngineError(e)) throw e;
    return { field: e.field ?? "clockHz", message: e.message };
  }
}
export {
  accuracyBudget,
  type AccuracyBudget,
  type BudgetInput,
  type BudgetTerm,
  type ClockVerdict,
  type GateDrive,
  type GateVerdict,
  gateVerdict,
} from "./budget";
export { COMMON_CRYSTALS_HZ, suggestCrystals, type CrystalSuggestion } from "./crystals";
