import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { addComment, COMMENT_ROLES, commentInput, listComments } from "@/lib/review/comments";
import { loadRevisionForReview } from "@/lib/review/load";

// GET /api/v1/revisions/:id/comments: every comment, oldest first.
export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  await requireUser({ roles: COMMENT_ROLES, req });
  await loadRevisionForReview(id);
  return Response.json({ comments: await listComments(id) });
});

// POST /api/v1/revisions/:id/comments { body, filePath?, line? } (admins, engineers, reviewers).
export const POST = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const input = commentInput.parse(await readJson(req));
  const user = await requireUser({ roles: COMMENT_ROLES, req });
  return Response.json({ comment: await addComment(user, id, input) }, { status: 201 });
});
