// What a revision row keeps in its jsonb columns, for the pages and other
// helpers (compare, review, field) that read them.
import type { AccuracyBudget, StageAnalysis, TimerPlan } from "@/lib/engine";
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
};

/** revisions.plans: one entry per target, in target order. */
export type StoredPlan = { target: TargetSnapshot; plan: TimerPlan; budget: AccuracyBudget | null };

/** revisions.spec is the exact BundleSpec the files were built from. */
export type StoredSpec = BundleSpec;
export type StoredAnalysis = StageAnalysis;
