// GET: the revisions of a retrofit. POST: generate the next revision from the
// retrofit's current stage and targets (422 names a target that cannot be planned).
// The generation runs as a job on a worker (compilers and emulators must not run
// inside a request); this request waits for the job and answers with its outcome.
import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { ApiError, notFound } from "@/lib/api/errors";
import { requireUser } from "@/lib/auth/guard";
import { EDIT, READ_ALL } from "@/lib/auth/roles";
import { awaitGeneration, requestGeneration } from "@/lib/jobs/generate-job";
import { getRetrofitById } from "@/lib/retrofits/get";
import { getRevisionById, listRevisionsByRetrofit } from "@/lib/retrofits/revisions";
import { generateBodySchema } from "@/lib/validation/workspace";

type P = { id: string };

export const GET = apiRoute<P>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Retrofit");
  await requireUser({ roles: READ_ALL, req });
  if (!(await getRetrofitById({ id }))) throw notFound("Retrofit");
  return Response.json({ revisions: await listRevisionsByRetrofit({ retrofitId: id }) });
});

export const POST = apiRoute<P>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Retrofit");
  // The body is optional: an empty POST generates with no note.
  const hasBody = req.headers.get("content-length") !== "0" && req.body !== null;
  const body = generateBodySchema.parse(hasBody ? await readOptionalJson(req) : undefined);
  const user = await requireUser({ roles: EDIT, req });
  const jobId = await requestGeneration({ retrofitId: id, userId: user.id, note: body.note });
  const outcome = await awaitGeneration(jobId);
  if (!outcome.ok) throw new ApiError(outcome.code, outcome.message, outcome.fields);
  const revision = await getRevisionById({ id: outcome.revisionId });
  if (!revision) throw notFound("Revision");
  return Response.json(
    { revision },
    { status: 201, headers: { location: `/api/v1/revisions/${revision.id}` } },
  );
});

async function readOptionalJson(req: Request): Promise<unknown> {
  const copy = req.clone();
  return (await copy.text()).trim() ? readJson(req) : undefined;
}
