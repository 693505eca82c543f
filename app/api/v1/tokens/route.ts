// GET: the caller's API tokens (prefix only). POST: a new token; the secret is
// in this one answer and never again.
import { apiRoute, readJson, secretJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { createToken, listTokensByUser } from "@/lib/retrofits/tokens";
import { tokenBodySchema } from "@/lib/validation/workspace";

export const GET = apiRoute(async (req) => {
  const user = await requireUser({ roles: ANY, req });
  return Response.json({ tokens: await listTokensByUser({ userId: user.id }) });
});

export const POST = apiRoute(async (req) => {
  const body = tokenBodySchema.parse(await readJson(req));
  const user = await requireUser({ roles: ANY, req });
  const token = await createToken({ userId: user.id, name: body.name });
  return secretJson({ token }, { status: 201 });
});
