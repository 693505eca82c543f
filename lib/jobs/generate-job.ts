// Revision generation as a job. The request inserts the revision in state
// "building" and sends this job in the same transaction (startRevision); a
// worker then builds it (buildRevision: one transaction stores files, images
// and bundle, so a worker killed mid-job leaves the revision "building" and
// the queue runs the job again after its expiry). A build that cannot succeed
// (compiler error, missing toolchain) ends "failed" with its reason and the
// job completes: retrying would fail the same way.
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import {
  buildRevision,
  failRevision,
  startRevision,
  type BuildOutcome,
  type StartedRevision,
} from "@/lib/revisions/generate";
import type { BuildState } from "@/lib/revisions/build-state";
import { sendJob } from "./boss";
import { QUEUES } from "./queues";

export type GenerateJob = { revisionId: number };

export function runGenerateJob(data: GenerateJob): Promise<BuildOutcome> {
  return buildRevision(data.revisionId);
}

/**
 * The queue gave up on a job (retries spent on errors a retry could cure, such
 * as a database that stayed away): the revision must not stay "building".
 */
export async function giveUpGeneration(data: GenerateJob, message: string): Promise<void> {
  await failRevision(data.revisionId, `The build was tried several times and did not finish: ${message}`);
}

/** Starts a revision (state "building", number taken) and queues its build; refusals throw ApiError. */
export async function requestGeneration(args: {
  retrofitId: number;
  userId: number;
  note?: string;
}): Promise<StartedRevision & { jobId: string }> {
  let jobId = "";
  const started = await startRevision(args, async (tx, revisionId) => {
    jobId = await sendJob(QUEUES.generateRevision, { revisionId } satisfies GenerateJob, tx);
  });
  return { ...started, jobId };
}

const POLL_MS = 250;

/** Polls a revision until its build is ready or failed (scripts' "wait" mode, tests). */
export async function awaitBuild(
  revisionId: number,
  timeoutMs = 180_000,
): Promise<{ buildState: Exclude<BuildState, "building">; buildError: string | null }> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const [row] = await db
      .select({ buildState: revisions.buildState, buildError: revisions.buildError })
      .from(revisions)
      .where(eq(revisions.id, revisionId));
    if (!row) throw new ApiError("not_found", "Revision not found.");
    if (row.buildState !== "building") {
      return { buildState: row.buildState, buildError: row.buildError };
    }
    if (Date.now() > until) {
      throw new ApiError(
        "unavailable",
        `Revision ${revisionId} is still building; no worker has finished it yet. Its page shows the progress.`,
      );
    }
    await new Promise((r) => setTimeout(r, POLL_MS));
  }
}
