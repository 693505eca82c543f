// GET /api/v1/revisions/:id/files/<path>: one file as text/plain.
import { notFound } from "@/lib/api/errors";
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { getRevisionFile } from "@/lib/retrofits/revisions";
import { loadReadableRevision } from "@/lib/revisions/load";

export const GET = apiRoute<{ id: string; path: string[] }>(async (req, ctx) => {
  const params = await ctx.params;
  const id = parseId(params.id, "Revision");
  const path = params.path.map(decodeURIComponent).join("/");
  const user = await requireUser({ roles: ANY, req });
  await loadReadableRevision({ id, user });
  const file = await getRevisionFile({ revisionId: id, path });
  if (!file) throw notFound(`File ${path}`);
  return new Response(file.content, {
    headers: {
      "content-type": "text/plain; charset=utf-8",
      etag: `"${file.sha256}"`,
      "x-content-sha256": file.sha256,
    },
  });
});
