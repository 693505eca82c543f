// Per-target build progress of a revision, written by the worker while it
// builds (and by anything else that runs inside a build, such as emulation).
// Each call merges one target's entry into revisions.build_progress with a
// single UPDATE, so targets built side by side never overwrite each other.
import { sql } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { BUILD_STEPS, type BuildStep, type TargetProgress } from "@/lib/revisions/build-state";

/** Longest reason kept: a compiler's first message, not its whole log. */
const REASON_MAX = 500;

/**
 * Records that `target` (the bundle folder, e.g. "atmega328p" or "attiny85-2")
 * of a building revision reached `step`. Only a revision still building is
 * changed, so a late report never touches a finished one.
 */
export async function reportProgress(
  revisionId: number,
  target: string,
  step: BuildStep,
  reason?: string,
  tx?: Tx,
): Promise<void> {
  if (!BUILD_STEPS.includes(step)) throw new Error(`Unknown build step "${step}".`);
  const entry: Pick<TargetProgress, "step" | "reason"> = {
    step,
    ...(reason ? { reason: reason.slice(0, REASON_MAX) } : {}),
  };
  await (tx ?? db).execute(sql`
    update revisions
       set build_progress = jsonb_set(
             build_progress,
             array[${target}::text],
             coalesce(build_progress -> ${target}, '{}'::jsonb) - 'reason' || ${JSON.stringify(entry)}::jsonb)
     where id = ${revisionId} and build_state = 'building'`);
}
