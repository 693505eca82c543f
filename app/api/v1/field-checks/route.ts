// POST: record a field check against an approved revision (limits and verdict
// computed here). GET: checks of one retrofit or one revision.
import { ApiError } from "@/lib/api/errors";
import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY, FIELD } from "@/lib/auth/roles";
import { listFieldChecks } from "@/lib/field/queries";
import { FIELD_CHECK_MAX_BYTES, fieldCheckSchema, recordFieldCheck } from "@/lib/field/record-check";

export const POST = apiRoute(async (req) => {
  const input = fieldCheckSchema.parse(await readJson(req, FIELD_CHECK_MAX_BYTES));
  const user = await requireUser({ roles: FIELD, req });
  const check = await recordFieldCheck(user, input);
  return Response.json({ check }, { status: 201 });
});

export const GET = apiRoute(async (req) => {
  const q = new URL(req.url).searchParams;
  const retrofitId = q.get("retrofitId");
  const revisionId = q.get("revisionId");
  if (!retrofitId && !revisionId) {
    throw new ApiError("bad_request", "Ask for ?retrofitId= or ?revisionId=.");
  }
  const filter = {
    retrofitId: retrofitId ? parseId(retrofitId, "Retrofit") : undefined,
    revisionId: revisionId ? parseId(revisionId, "Revision") : undefined,
  };
  const user = await requireUser({ roles: ANY, req });
  const checks = await listFieldChecks({ user, ...filter });
  return Response.json({ checks });
});
