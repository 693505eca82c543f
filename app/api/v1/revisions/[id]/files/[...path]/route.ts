// GET /api/v1/revisions/:id/files/<path>: one file as text/plain, or an image
// (<device>/firmware/*) as application/octet-stream.
import { contentDisposition } from "@/lib/api/content-disposition";
import { notFound } from "@/lib/api/errors";
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { getRevisionFile, getRevisionImage } from "@/lib/retrofits/revisions";
import { loadReadableRevision } from "@/lib/revisions/load";

export const GET = apiRoute<{ id: string; path: string[] }>(async (req, ctx) => {
  const params = await ctx.params;
  const id = parseId(params.id, "Revision");
  // The router has decoded each segment once already; decoding again turned
  // "%25E0" into a URIError (a 500) and "%252F" into a slash.
  const path = params.path.join("/");
  const user = await requireUser({ roles: ANY, req });
  await loadReadableRevision({ id, user });
  const file = await getRevisionFile({ revisionId: id, path });
  if (!file) {
    const image = await getRevisionImage({ revisionId: id, path });
    if (!image) throw notFound(`File ${path}`);
    return new Response(new Uint8Array(image.content), {
      headers: {
        "content-type": "application/octet-stream",
        "content-disposition": contentDisposition(path.split("/").pop() ?? "firmware"),
        etag: `"${image.sha256}"`,
        "x-content-sha256": image.sha256,
      },
    });
  }
  return new Response(file.content, {
    headers: {
      "content-type": "text/plain; charset=utf-8",
      etag: `"${file.sha256}"`,
      "x-content-sha256": file.sha256,
    },
  });
});
