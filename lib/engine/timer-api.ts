// Public surface of the devices and the timer solver (engine.md sections 2-4).
import { DEVICES, deviceInfo } from "./devices";
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
export { LONGEST_PERIOD_S, clockMakes, longestPeriodS } from "./solver/validate";

export function listDevices(): DeviceInfo[] {
  return DEVICES.map(deviceInfo);
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
