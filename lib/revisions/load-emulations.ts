// A revision's emulator results with its target folders in order, for pages
// that already checked the read rule (compare page).
import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { progressList, type BuildProgress } from "./build-state";
import type { RevisionEmulations } from "./emulations";

export async function loadEmulations(revisionId: number) {
  const [row] = await db
    .select({
      progress: revisions.buildProgress,
      emulations: revisions.emulations,
      buildState: revisions.buildState,
      unprovenReason: revisions.unprovenReason,
    })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  if (!row) return null;
  return {
    folders: progressList(row.progress as BuildProgress).map((p) => p.folder),
    emulations: row.emulations as RevisionEmulations,
    buildState: row.buildState,
    unprovenReason: row.unprovenReason,
  };
}
