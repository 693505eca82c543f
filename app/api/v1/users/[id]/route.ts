import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ADMIN } from "@/lib/auth/roles";
import { changeUser } from "@/lib/review/accounts";

// PATCH /api/v1/users/:id { role?, site?, disabled? } (admins): each change is audited.
export const PATCH = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "User");
  const body = await readJson(req);
  const admin = await requireUser({ roles: ADMIN, req });
  return Response.json({ user: await changeUser(admin, id, body) });
});
