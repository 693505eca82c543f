// GET /api/v1/revisions/:id: the revision's snapshot (spec, analysis, plans)
// and its file list, without the bundle bytes.
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { listRevisionFiles } from "@/lib/retrofits/revisions";
import { loadReadableRevision } from "@/lib/revisions/load";

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const user = await requireUser({ roles: ANY, req });
  const { revision, retrofit } = await loadReadableRevision({ id, user });
  const files = (await listRevisionFiles({ revisionId: id })).map((f) => ({
    path: f.path,
    sha256: f.sha256,
    bytes: Buffer.byteLength(f.content),
  }));
  return Response.json({
    revision,
    retrofit: { id: retrofit.id, name: retrofit.name, site: retrofit.site, assetTag: retrofit.assetTag },
    files,
    bundleUrl: `/api/v1/revisions/${id}/bundle`,
  });
});
