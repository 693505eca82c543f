// GET the photo taken for one checklist line of a field check. Readable by
// whoever may read the check (technicians: released revisions of their site).
import { ApiError } from "@/lib/api/errors";
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { getFieldCheckPhoto, listFieldChecks } from "@/lib/field/queries";

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Photo");
  const user = await requireUser({ roles: ANY, req });
  const photo = await getFieldCheckPhoto({ id });
  const readable = photo ? await listFieldChecks({ user, ids: [photo.fieldCheckId] }) : [];
  if (!photo || readable.length === 0) throw new ApiError("not_found", "Photo was not found.");
  return new Response(new Uint8Array(photo.content), {
    headers: {
      "Content-Type": photo.mediaType,
      "Content-Length": String(photo.byteSize),
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
    },
  });
});
