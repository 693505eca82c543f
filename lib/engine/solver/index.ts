// Timer solver: exact search over every legal setting (engine.md section 3).
export { planTarget, MIN_ISR_CPU_CYCLES, minIsrIntervalCycles } from "./plan";
export { bestHardware, betterHardware, type HardwareChoice } from "./hardware";
export { bestIsr, betterIsr, type IsrChoice } from "./isr";
export { bruteForceBestPeriod, bruteForceBestIsr } from "./brute-force";
export { nearestHighCounts } from "./high-time";
