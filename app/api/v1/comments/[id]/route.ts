import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { COMMENT_ROLES, resolveInput, setResolved } from "@/lib/review/comments";

// PATCH /api/v1/comments/:id { resolved: true | false }: resolves or reopens a
// thread (its first comment). Admins, engineers, reviewers.
export const PATCH = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Comment");
  const input = resolveInput.parse(await readJson(req));
  const user = await requireUser({ roles: COMMENT_ROLES, req });
  return Response.json({ comment: await setResolved(user, id, input.resolved) });
});
