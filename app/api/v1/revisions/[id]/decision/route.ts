import { z } from "zod";
import { paragraphText } from "@/lib/validation/plain-text";
import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { REVIEW } from "@/lib/auth/roles";
import { decideRevision } from "@/lib/review/decide";
import { readDecision } from "@/lib/review/words";

const body = z
  .object({
    // Old values ("approved", "changes_requested") still accepted: lib/review/words.ts.
    decision: z.string().transform((v, ctx) => {
      const d = readDecision(v);
      if (!d) {
        ctx.addIssue({ code: "custom", message: 'decision: send "release" or "return".' });
        return z.NEVER;
      }
      return d;
    }),
    note: z.optional(paragraphText("The note", { max: 4000 })),
    /** reason for releasing despite a target whose budget misses (required then) */
    override: z.optional(paragraphText("The override reason", { max: 2000 })),
  })
  .strict();

// POST /api/v1/revisions/:id/decision { decision: "release" | "return", note?, override? }:
// a release of a revision with a target whose budget misses needs `override` (the reason), else 422.
// awaiting_check -> released | returned (reviewers, admins; never the revision's
// author). 409 when the revision is no longer awaiting check, e.g. another
// reviewer decided first, or when a newer revision could be released instead.
export const POST = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Revision");
  const input = body.parse(await readJson(req));
  const user = await requireUser({ roles: REVIEW, req });
  return Response.json({
    revision: await decideRevision(user, id, input.decision, input.note ?? "", input.override ?? ""),
  });
});
