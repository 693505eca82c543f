// GET /api/v1/revisions/:id/bundle: the stored zip, byte for byte. ETag is the
// zip's sha256, so If-None-Match answers 304 without sending it again; each
// full download is audited.
import { contentDisposition } from "@/lib/api/content-disposition";
import { ApiError, notFound } from "@/lib/api/errors";
import { apiRoute, parseId } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { getRevisionDownload } from "@/lib/retrofits/revisions";
import { bundleFileName, etagMatches } from "@/lib/revisions/bundle-http";
import { assertCanReadRevision } from "@/lib/revisions/access";

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const user = await requireUser({ roles: ANY, req });
  const revision = await getRevisionDownload({ id });
  if (!revision) throw notFound("Revision");
  assertCanReadRevision(user, revision, revision);
  // A revision still building (or whose build failed) has no bundle yet: never an empty zip.
  if (revision.buildState !== "ready") {
    throw new ApiError(
      "conflict",
      revision.buildState === "building"
        ? `r${revision.number} is still being built; its bundle can be downloaded once every target has built.`
        : `r${revision.number} did not build, so it has no bundle.`,
    );
  }
  const etag = `"${revision.bundleSha256}"`;
  const common = { etag, "cache-control": "private, no-cache" };
  if (etagMatches(req.headers.get("if-none-match"), revision.bundleSha256)) {
    return new Response(null, { status: 304, headers: common });
  }
  await recordAudit({
    actorId: user.id,
    action: "revision.download",
    subjectType: "revision",
    subjectId: id,
    details: { sha256: revision.bundleSha256, via: user.via },
  });
  const name = bundleFileName(revision.assetTag, revision.number);
  return new Response(new Uint8Array(revision.bundle), {
    headers: {
      ...common,
      "content-type": "application/zip",
      "content-length": String(revision.bundle.length),
      "content-disposition": contentDisposition(name),
      "x-content-sha256": revision.bundleSha256,
    },
  });
});
