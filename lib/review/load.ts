// A revision with its retrofit, for the review actions and pages.
import "server-only";
import { eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { retrofits, revisions, users } from "@/db/schema";
import { notFound } from "@/lib/api/errors";

export async function loadRevisionForReview(id: number, tx?: Tx) {
  const [row] = await (tx ?? db)
    .select({
      revision: {
        id: revisions.id,
        retrofitId: revisions.retrofitId,
        number: revisions.number,
        state: revisions.state,
        note: revisions.note,
        createdBy: revisions.createdBy,
        createdAt: revisions.createdAt,
        submittedAt: revisions.submittedAt,
        decidedBy: revisions.decidedBy,
        decidedAt: revisions.decidedAt,
        supersededAt: revisions.supersededAt,
        bundleSha256: revisions.bundleSha256,
        buildState: revisions.buildState,
        buildProgress: revisions.buildProgress,
        emulations: revisions.emulations,
        unprovenReason: revisions.unprovenReason,
        engineVersion: revisions.engineVersion,
      },
      retrofit: {
        id: retrofits.id,
        name: retrofits.name,
        site: retrofits.site,
        assetTag: retrofits.assetTag,
        mainsPowered: retrofits.mainsPowered,
        drivesThyristor: retrofits.drivesThyristor,
      },
      author: { id: users.id, name: users.name, email: users.email },
    })
    .from(revisions)
    .innerJoin(retrofits, eq(retrofits.id, revisions.retrofitId))
    .innerJoin(users, eq(users.id, revisions.createdBy))
    .where(eq(revisions.id, id));
  if (!row) throw notFound("Revision");
  return row;
}

export type RevisionForReview = Awaited<ReturnType<typeof loadRevisionForReview>>;
