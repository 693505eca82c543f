// What a revision row keeps in its jsonb columns, for the pages and other
// helpers (compare, review, field) that read them.
import type {
  AccuracyBudget,
  GateDrive,
  InputEdge,
  PlanStart,
  RetriggerRule,
  StageAnalysis,
  TimerPlan,
} from "@/lib/engine";

/** A target's start (engine.md section 6); every field optional, SI units. */
export type TargetTrigger = {
  /** absent = by the stage: zero-cross for a synchronised stage, trigger for a 555 one-shot, else free */
  start?: PlanStart;
  /** absent = the stage's firing delay, or 0 */
  delayS?: number;
  /** absent = the old stage's pulse */
  pulseS?: number;
  /** trigger: shortest time between triggers */
  minIntervalS?: number;
  edge?: InputEdge;
  retrigger?: RetriggerRule;
};
export type { GateDrive };
import type { BundleSpec } from "@/lib/bundle";

/** The target as it was when the revision was generated. */
export type TargetSnapshot = {
  device: string;
  clockSource: string;
  clockHz: number;
  clockAccuracyPpm: number | null;
  mode: "pwm" | "toggle" | "isr" | null;
  timer: string | null;
  requiredTolerancePct: number | null;
  /** Absent in revisions made before polarity was planned: active high. */
  activeLow?: boolean;
  /** Absent or null: the start follows the stage (see TargetTrigger). */
  trigger?: TargetTrigger | null;
  /** Absent or null: no gate-drive needs given. */
  gateDrive?: GateDrive | null;
};

/** revisions.plans: one entry per target, in target order. */
export type StoredPlan = { target: TargetSnapshot; plan: TimerPlan; budget: AccuracyBudget | null };

/** revisions.spec is the exact BundleSpec the files were built from. */
export type StoredSpec = BundleSpec;
export type StoredAnalysis = StageAnalysis;
