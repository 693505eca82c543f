// Shapes of the bundle contract (engine.md section 5). `BundlePlan` lists the
// TimerPlan fields the generator reads, so a hand-built plan and the solver's
// plan are interchangeable here.
import type { StageControl } from "@/lib/engine/adjust/types";
import type { Stage, StageAnalysis } from "@/lib/engine/stage-types";

export type PlanMode = "pwm" | "toggle" | "isr";

export interface BundleTargetRequest {
  device: string;
  clockHz: number;
  periodS: number;
  highS: number;
  mode?: PlanMode;
  timer?: string;
  /** Clock option id from listDevices, passed to the engine unchanged (firmware.md); omitted = the device default. */
  clockSource?: string;
  /** Package name from DeviceInfo.packages; omitted = the device's default package. */
  package?: string;
  /** engine.md section 6; "trigger" / "zero-cross" firmware exists for the AVRs, other devices refuse it */
  start?: "free" | "trigger" | "zero-cross";
  delayS?: number;
  edge?: "rising" | "falling" | "both";
  retrigger?: "ignore" | "restart";
  /** The engineer's required tolerance in percent; the checklist's pass limits follow it. */
  requiredTolerancePct?: number;
}

export interface BundleRetrofit {
  name: string;
  site?: string;
  assetTag?: string;
  mainsPowered?: boolean;
  drivesThyristor?: boolean;
}

export interface BundleSpec {
  retrofit: BundleRetrofit;
  revision: number;
  stage: Stage;
  /** the stage's adjustable value; a pot is read on an ADC pin by targets with ADC firmware */
  control?: StageControl | null;
  targets: BundleTargetRequest[];
}

export interface BundleFile {
  path: string;
  /** Text for sources and documents; bytes for the prebuilt images under <device>/firmware/. */
  content: string | Uint8Array;
}

export interface BundlePin {
  port: string;
  function: string;
  packagePin: number | string;
  package: string;
  portName?: string;
  bit?: number;
  alternateFunction?: number;
  gpio?: number;
  slice?: number;
  channel?: "A" | "B";
  fromMemory?: boolean;
}

export interface BundlePlan {
  device: string;
  timer: string;
  mode: PlanMode;
  clockHz: number;
  divider: number;
  periodCounts: number;
  modeFactor: number;
  softwareDivider: number;
  highCounts: number;
  periodS: number;
  highS: number;
  periodErrorPpm: number;
  highErrorPpm: number;
  registers: Record<string, number>;
  pin: BundlePin;
  notes?: string[];
  jitterS?: number;
  clockAccuracyPpm?: number;
  clockSource?: string;
  activeLow?: boolean;
  // Triggered plans (engine.md section 6; TimerPlan's fields of the same names).
  start?: "free" | "trigger" | "zero-cross";
  delayS?: number;
  delayCounts?: number;
  latencyS?: number;
  latencyCycles?: number;
  latencyBasis?: string;
  input?: BundlePin;
  edge?: "rising" | "falling" | "both";
  edgeSetting?: string;
  retrigger?: "ignore" | "restart";
  inputConditioning?: string;
}

export type { Stage, StageAnalysis };
