// A revision with its retrofit, after the read rule: what every
// /api/v1/revisions/:id handler and the revision page start from.
import "server-only";
import { notFound } from "@/lib/api/errors";
import type { AuthUser } from "@/lib/auth/guard";
import { getRetrofitById } from "@/lib/retrofits/get";
import { getRevisionById } from "@/lib/retrofits/revisions";
import { assertCanReadRevision } from "./access";

export async function loadReadableRevision({ id, user }: { id: number; user: AuthUser }) {
  const revision = await getRevisionById({ id });
  if (!revision) throw notFound("Revision");
  const retrofit = await getRetrofitById({ id: revision.retrofitId });
  if (!retrofit) throw notFound("Revision");
  assertCanReadRevision(user, revision, retrofit);
  return { revision, retrofit };
}
