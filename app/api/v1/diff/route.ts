import { z } from "zod";
import { contentDisposition } from "@/lib/api/content-disposition";
import { apiRoute } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { unifiedPatch } from "@/lib/diff";
import { ApiError } from "@/lib/api/errors";
import { compareRevisions, loadPair, unbuiltMessage, unbuiltSides } from "@/lib/diff/load";
import { dbIdText } from "@/lib/validation/id";

const query = z.object({ a: dbIdText, b: dbIdText, format: z.enum(["json", "patch"]).default("json") });

// GET /api/v1/diff?a=<revId>&b=<revId>[&format=patch]: what changed from a to b.
// JSON: { retrofitId, a, b, numbers: [{ key, what, before, after, ... }], files: [...] }.
// format=patch: one unified diff (text/x-diff), a/ = a, b/ = b.
// While a side is still building or failed: JSON has files [] and `unbuilt`
// naming it; the patch answers 409 (there is no file text to diff yet).
export const GET = apiRoute(async (req) => {
  const params = Object.fromEntries(new URL(req.url).searchParams);
  const q = query.parse(params);
  const user = await requireUser({ roles: ANY, req });
  if (q.format === "patch") {
    const { a, b } = await loadPair(user, q.a, q.b);
    const unbuilt = unbuiltSides(a, b);
    if (unbuilt.length > 0) throw new ApiError("conflict", unbuiltMessage(unbuilt));
    return new Response(unifiedPatch(a, b, a.files, b.files), {
      headers: {
        "content-type": "text/x-diff; charset=utf-8",
        "content-disposition": contentDisposition(`r${a.number}-r${b.number}.diff`, "inline"),
      },
    });
  }
  return Response.json(await compareRevisions(user, q.a, q.b));
});
