// Adjustable stage values: potentiometer, trimmer, selector; travel analysis and the ADC table of the target.
export type * from "./types";
export { taperFraction, taperRotation, LOG_TAPER_BASE } from "./taper";
export { analyzeTravel, validateControl, controlValue, stageAt, DEFAULT_TRAVEL_POINTS } from "./travel";
export { buildAdcTable, stepForCount, DEFAULT_HYSTERESIS_COUNTS } from "./adc-table";
export type { AdcTable, AdcStep, AdcTableRequest } from "./adc-table";
export { travelChecklist, trimmerCalibration, MIDDLE_BY_EYE } from "./checklist";
export type { TravelCheckLine, TrimmerCalibration } from "./checklist";
export { buildSelectorTable } from "./selector";
export type { SelectorTable, SelectorPosition } from "./selector";
export { commonDividerPlan } from "./adc-table";
export type { TablePlanRequest } from "./adc-table";
export { buildTrimRange, trimHighCounts } from "./trim";
export type { TrimRange, TrimPoint, TrimPlan } from "./trim";
