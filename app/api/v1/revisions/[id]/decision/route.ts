import { z } from "zod";
import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { REVIEW } from "@/lib/auth/roles";
import { decideRevision } from "@/lib/review/decide";

const body = z
  .object({
    decision: z.enum(["approved", "changes_requested"], {
      message: 'Send "approved" or "changes_requested".',
    }),
    note: z.string().trim().max(4000).optional(),
  })
  .strict();

// POST /api/v1/revisions/:id/decision { decision, note? }: in review -> approved |
// changes requested (reviewers, admins; never the revision's author). 409 when
// the revision is no longer in review, e.g. another reviewer decided first.
export const POST = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const input = body.parse(await readJson(req));
  const user = await requireUser({ roles: REVIEW, req });
  return Response.json({ revision: await decideRevision(user, id, input.decision, input.note ?? "") });
});
