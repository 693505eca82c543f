// The check queue: revisions awaiting check, newest first.
import "server-only";
import { desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits, revisions, users } from "@/db/schema";

export async function reviewQueue() {
  return db
    .select({
      id: revisions.id,
      number: revisions.number,
      submittedAt: revisions.submittedAt,
      createdBy: revisions.createdBy,
      author: users.name,
      retrofitId: retrofits.id,
      retrofitName: retrofits.name,
      site: retrofits.site,
      assetTag: retrofits.assetTag,
    })
    .from(revisions)
    .innerJoin(retrofits, eq(retrofits.id, revisions.retrofitId))
    .innerJoin(users, eq(users.id, revisions.createdBy))
    .where(eq(revisions.state, "awaiting_check"))
    .orderBy(desc(revisions.submittedAt), desc(revisions.id));
}
