import "server-only";
// Workflow on a retrofit (submit, release or return, comments, field checks,
// use-as-stage, generation) stops once it is archived. The check takes the
// retrofit row FOR UPDATE inside the action's transaction, the same lock
// archiveRetrofit takes, so an archive that commits first is seen and one that
// comes later waits for the action: no action slips in after the archive.
import { eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { retrofits } from "@/db/schema";
import { ApiError, notFound } from "@/lib/api/errors";

/** Locks the retrofit row; a 409 naming the archived state when it is archived. `doing` reads "submit r3". */
export async function lockLiveRetrofit(tx: Tx, retrofitId: number, doing: string): Promise<void> {
  const [row] = await tx
    .select({ id: retrofits.id, name: retrofits.name, archivedAt: retrofits.archivedAt })
    .from(retrofits)
    .where(eq(retrofits.id, retrofitId))
    .for("update");
  if (!row) throw notFound("Retrofit");
  if (row.archivedAt)
    throw new ApiError(
      "conflict",
      `"${row.name}" is archived (since ${row.archivedAt.toISOString().slice(0, 10)}): it keeps its revisions, checks and comments, but you cannot ${doing} now. Nothing was changed.`,
      { state: "archived" },
    );
}
