// GET /api/v1/revisions/:id/build: the build state and per-target progress of
// a revision (building, ready, failed with the reason). Small on purpose: the
// revision page polls it every second while the revision builds.
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { progressList, type BuildProgress, type BuildStatus } from "@/lib/revisions/build-state";
import { loadReadableRevision } from "@/lib/revisions/load";

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const user = await requireUser({ roles: ANY, req });
  const { revision } = await loadReadableRevision({ id, user });
  const status: BuildStatus = {
    id: revision.id,
    number: revision.number,
    buildState: revision.buildState,
    buildError: revision.buildError,
    targets: progressList(revision.buildProgress as BuildProgress),
  };
  return Response.json(status, { headers: { "cache-control": "no-store" } });
});
