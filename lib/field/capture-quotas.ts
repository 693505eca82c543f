import "server-only";
// Capture quotas: every limit in one place. Bytes are the uploaded files'
// sizes (the stored levels come on top, about 1.2 times the samples' float
// size). Checked twice: before the body is read (a cheap early refusal) and
// again inside the insert's transaction under a per-user and a per-retrofit
// advisory lock, so parallel uploads cannot pass a limit together.
import { and, eq, sql } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { captures } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";

export const CAPTURE_QUOTA = {
  perUser: { bytes: 512 * 1024 * 1024, count: 200 },
  perRetrofit: { bytes: 256 * 1024 * 1024, count: 100 },
} as const;

type Use = { bytes: number; count: number };

async function usage(tx: Tx | typeof db, where: ReturnType<typeof eq>): Promise<Use> {
  const [row] = await tx
    .select({
      bytes: sql<number>`coalesce(sum(${captures.byteSize}), 0)`.mapWith(Number),
      count: sql<number>`count(*)`.mapWith(Number),
    })
    .from(captures)
    .where(and(where));
  return row;
}

const mib = (n: number) => `${(n / (1024 * 1024)).toFixed(1)} MiB`;

function refusal(who: [string, string], limit: Use, used: Use, adding: number): ApiError | null {
  if (used.count + 1 > limit.count)
    return new ApiError(
      "conflict",
      `${who[0]} already ${who[1]} ${used.count} captures, the limit of ${limit.count}. Delete captures that are no longer needed, then upload again.`,
      { file: `At most ${limit.count} captures.` },
    );
  if (used.bytes + adding > limit.bytes)
    return new ApiError(
      "payload_too_large",
      `${who[0]} would hold ${mib(used.bytes + adding)} of captures, past the limit of ${mib(limit.bytes)} (${mib(used.bytes)} used now). Delete captures that are no longer needed, then upload again.`,
      { file: `At most ${mib(limit.bytes)} of captures.` },
    );
  return null;
}

/** Throws the 409 (count) or 413 (bytes) naming the limit an upload of `bytes` would pass. */
export async function checkCaptureQuota(
  input: { uploadedBy: number; retrofitId: number | null; bytes: number },
  tx?: Tx,
): Promise<void> {
  const q = tx ?? db;
  if (tx) {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('capture-quota:user'), ${input.uploadedBy})`);
    if (input.retrofitId !== null)
      await tx.execute(
        sql`select pg_advisory_xact_lock(hashtext('capture-quota:retrofit'), ${input.retrofitId})`,
      );
  }
  const mine = await usage(q, eq(captures.uploadedBy, input.uploadedBy));
  const user = refusal(["You", "have"], CAPTURE_QUOTA.perUser, mine, input.bytes);
  if (user) throw user;
  if (input.retrofitId === null) return;
  const its = await usage(q, eq(captures.retrofitId, input.retrofitId));
  const retrofit = refusal(["This retrofit", "has"], CAPTURE_QUOTA.perRetrofit, its, input.bytes);
  if (retrofit) throw retrofit;
}
