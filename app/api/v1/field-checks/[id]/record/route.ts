// GET one field check as a PDF record (signer, board, device, results,
// checklist lines with notes and photos). Same readers as the check itself.
import { ApiError } from "@/lib/api/errors";
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { cautionLines } from "@/lib/bundle";
import { deviceName } from "@/components/retrofit/format";
import { fieldRecordPdf } from "@/lib/field/record-pdf";
import { getRevisionWithRetrofit, listFieldCheckPhotos, listFieldChecks } from "@/lib/field/queries";

/** ASCII letters, digits, - and _ only: safe inside a quoted Content-Disposition (RFC 6266). */
function fileName(assetTag: string, revision: number, id: number): string {
  const base = assetTag.replace(/[^A-Za-z0-9_-]+/g, "-").replace(/^-+|-+$/g, "") || "retrofit";
  return `field-check-${base}-r${revision}-${id}.pdf`;
}

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Field check");
  const user = await requireUser({ roles: ANY, req });
  const [check] = await listFieldChecks({ user, ids: [id] });
  const found = check ? await getRevisionWithRetrofit({ id: check.revisionId }) : null;
  if (!check || !found) throw new ApiError("not_found", "Field check was not found.");
  const { revision, retrofit } = found;
  const photos = await listFieldCheckPhotos({ fieldCheckId: id });
  const pdf = await fieldRecordPdf({
    check,
    site: retrofit.site,
    bundleSha256: revision.bundleSha256,
    deviceName: check.device ? deviceName(check.device) : "-",
    cautions: cautionLines(retrofit),
    photos: new Map(
      photos.map((p) => [p.id, { mediaType: p.mediaType, content: new Uint8Array(p.content) }]),
    ),
  });
  return new Response(new Uint8Array(pdf), {
    headers: {
      "Content-Type": "application/pdf",
      "Content-Disposition": `attachment; filename="${fileName(check.assetTag, check.revisionNumber, id)}"`,
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
    },
  });
});
