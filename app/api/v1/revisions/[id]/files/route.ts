// GET /api/v1/revisions/:id/files: every generated file with its content, and
// the images (path, size, sha256; bytes from files/<path>).
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { listRevisionFiles, listRevisionImages } from "@/lib/retrofits/revisions";
import { loadReadableRevision } from "@/lib/revisions/load";

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const user = await requireUser({ roles: ANY, req });
  await loadReadableRevision({ id, user });
  return Response.json({
    files: await listRevisionFiles({ revisionId: id }),
    images: await listRevisionImages({ revisionId: id }),
  });
});
