import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { addComment, COMMENT_ROLES, commentInput, listComments, listThreads } from "@/lib/review/comments";
import { loadRevisionForReview } from "@/lib/review/load";

// GET /api/v1/revisions/:id/comments: `comments`, every comment written on this
// revision, oldest first; `threads`, what the revision shows (its own threads and
// those carried from earlier revisions, with replies, resolved state and carry mark).
export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  await requireUser({ roles: COMMENT_ROLES, req });
  await loadRevisionForReview(id);
  const [own, threads] = await Promise.all([listComments(id), listThreads(id)]);
  return Response.json({ comments: own, threads });
});

// POST /api/v1/revisions/:id/comments { body, filePath?, line?, anchorKind?, anchorKey?, parentId? }
// (admins, engineers, reviewers): a new thread on the revision, a file, a line, a
// quantity ("target1.periodS") or a register ("target1.register.ICR1"), or a reply.
export const POST = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const input = commentInput.parse(await readJson(req));
  const user = await requireUser({ roles: COMMENT_ROLES, req });
  return Response.json({ comment: await addComment(user, id, input) }, { status: 201 });
});
