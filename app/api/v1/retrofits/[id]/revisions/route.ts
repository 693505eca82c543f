// GET: the revisions of a retrofit. POST: generate the next revision from the
// retrofit's current stage and targets (422 names a target that cannot be planned).
// POST answers 202 at once: the revision exists in state "building" with its
// number, and a worker builds it (GET /api/v1/revisions/:id/build for progress).
// Scripts that want the finished revision ask to wait: `?wait=1` or the header
// `Prefer: wait` (RFC 7240); they get 201 with the revision, or 422 naming the
// target whose build failed.
import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { ApiError, notFound } from "@/lib/api/errors";
import { wantsWait } from "@/lib/api/prefer-wait";
import { requireUser } from "@/lib/auth/guard";
import { EDIT, READ_ALL } from "@/lib/auth/roles";
import { awaitBuild, requestGeneration } from "@/lib/jobs/generate-job";
import { getRetrofitById } from "@/lib/retrofits/get";
import { getRevisionById, listRevisionsByRetrofit } from "@/lib/retrofits/revisions";
import { failedFields } from "@/lib/revisions/generate";
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
  const started = await requestGeneration({ retrofitId: id, userId: user.id, note: body.note });
  const location = `/api/v1/revisions/${started.id}`;
  if (!wantsWait(req)) {
    return Response.json(
      {
        revision: { id: started.id, number: started.number, buildState: "building" },
        progress: `${location}/build`,
      },
      { status: 202, headers: { location } },
    );
  }
  const built = await awaitBuild(started.id);
  if (built.buildState === "failed") {
    throw new ApiError(
      "unprocessable",
      `r${started.number} did not build: ${built.buildError ?? "no reason recorded"}`,
      await failedFields(started.id),
    );
  }
  const revision = await getRevisionById({ id: started.id });
  if (!revision) throw notFound("Revision");
  return Response.json({ revision }, { status: 201, headers: { location } });
});

async function readOptionalJson(req: Request): Promise<unknown> {
  const copy = req.clone();
  return (await copy.text()).trim() ? readJson(req) : undefined;
}
