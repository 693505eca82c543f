// DELETE /api/v1/tokens/:id: revoke one of your own tokens.
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { revokeToken } from "@/lib/retrofits/tokens";

export const DELETE = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Token");
  const user = await requireUser({ roles: ANY, req });
  await revokeToken({ userId: user.id, id });
  return Response.json({ revoked: id });
});
