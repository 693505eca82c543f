import { z } from "zod";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { EDIT } from "@/lib/auth/roles";
import { submitRevision } from "@/lib/review/submit";

const body = z.object({ note: z.string().trim().max(2000).optional() }).strict();

// POST /api/v1/revisions/:id/submit { note? }: draft -> in review (engineers, admins).
export const POST = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const input = body.parse(await optionalJson(req));
  const user = await requireUser({ roles: EDIT, req });
  return Response.json({ revision: await submitRevision(user, id, input.note ?? "") });
});

/** The body is optional here: an empty body means no note. */
async function optionalJson(req: Request): Promise<unknown> {
  const text = await req.text();
  if (!text.trim()) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new ApiError("bad_request", "The request body is not valid JSON.");
  }
}
