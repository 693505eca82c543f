// Revision generation as a job. The worker runs generateRevision (one
// transaction: a worker killed mid-job leaves nothing behind, and the queue
// runs the job again after its expiry). Refusals from the inputs (a stage that
// does not oscillate, a target that cannot be planned) are answers, not
// failures: the job completes with the refusal and is never retried.
import { ApiError, type ApiErrorCode, type FieldErrors } from "@/lib/api/errors";
import { generateRevision, type GeneratedRevision } from "@/lib/revisions/generate";
import { boss, sendJob } from "./boss";
import { QUEUES } from "./queues";

export type GenerateJob = { retrofitId: number; userId: number; note?: string };

export type GenerateOutcome =
  | { ok: true; revisionId: number; number: number }
  | { ok: false; code: ApiErrorCode; message: string; fields?: FieldErrors };

export async function runGenerateJob(data: GenerateJob): Promise<GenerateOutcome> {
  try {
    const rev: GeneratedRevision = await generateRevision(data);
    return { ok: true, revisionId: rev.id, number: rev.number };
  } catch (e) {
    if (e instanceof ApiError) return { ok: false, code: e.code, message: e.message, fields: e.fields };
    throw e;
  }
}

export function requestGeneration(data: GenerateJob): Promise<string> {
  return sendJob(QUEUES.generateRevision, data);
}

const POLL_MS = 200;

/**
 * Waits for a generation job to finish; resolves with its outcome. A job the
 * queue gave up on (retries spent) rejects with its last error.
 */
export async function awaitGeneration(jobId: string, timeoutMs = 180_000): Promise<GenerateOutcome> {
  const b = await boss();
  const until = Date.now() + timeoutMs;
  for (;;) {
    const job = await b.getJobById<GenerateJob>(QUEUES.generateRevision, jobId, { includeArchive: true });
    if (!job) throw new Error(`Generation job ${jobId} is not in the queue.`);
    if (job.state === "completed") return job.output as GenerateOutcome;
    if (job.state === "failed" || job.state === "cancelled") {
      const out = job.output as { message?: string } | null;
      throw new Error(`Generation failed: ${out?.message ?? job.state}`);
    }
    if (Date.now() > until) {
      throw new ApiError(
        "unavailable",
        "The revision is still being built; no worker has finished it yet. Reload the retrofit in a minute.",
      );
    }
    await new Promise((r) => setTimeout(r, POLL_MS));
  }
}
