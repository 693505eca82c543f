import { z } from "zod";
import { paragraphText } from "@/lib/validation/plain-text";
import { apiRoute, parseId, readOptionalJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { EDIT } from "@/lib/auth/roles";
import { submitRevision } from "@/lib/review/submit";

const body = z
  .object({
    note: z.optional(paragraphText("The note", { max: 2000 })),
    // Required (422 naming it) when a target is not proven in an emulator.
    unprovenReason: z.optional(paragraphText("The reason", { max: 2000 })),
  })
  .strict();

// POST /api/v1/revisions/:id/submit { note?, unprovenReason? }: prepared -> awaiting_check (engineers, admins).
export const POST = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const input = body.parse(await readOptionalJson(req));
  const user = await requireUser({ roles: EDIT, req });
  return Response.json({ revision: await submitRevision(user, id, input.note ?? "", input.unprovenReason) });
});
