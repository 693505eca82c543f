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
  // Same 1 MiB limit as readJson (413, checked before the body is read when
  // Content-Length says so); only an empty body means "no options".
  const tooLarge = () => new ApiError("payload_too_large", `The body is larger than ${MAX_BODY} bytes.`);
  if (Number(req.headers.get("content-length") ?? "0") > MAX_BODY) throw tooLarge();
  const text = await req.text();
  if (Buffer.byteLength(text) > MAX_BODY) throw tooLarge();
  if (!text.trim()) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new ApiError("bad_request", "The request body is not valid JSON.");
  }
}

const MAX_BODY = 1024 * 1024;
