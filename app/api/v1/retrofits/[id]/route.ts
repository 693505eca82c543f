// GET, PATCH (facts, stage, targets) and DELETE (archive) one retrofit.
// Archived retrofits stay readable; they refuse edits.
import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { notFound } from "@/lib/api/errors";
import { requireUser } from "@/lib/auth/guard";
import { EDIT, READ_ALL } from "@/lib/auth/roles";
import { getRetrofitDetail } from "@/lib/retrofits/get";
import { archiveRetrofit, updateRetrofit } from "@/lib/retrofits/mutate";
import { listRevisionsByRetrofit } from "@/lib/retrofits/revisions";
import { updateRetrofitSchema } from "@/lib/validation/workspace";

type P = { id: string };

export const GET = apiRoute<P>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Retrofit");
  await requireUser({ roles: READ_ALL, req });
  const detail = await getRetrofitDetail({ id });
  if (!detail) throw notFound("Retrofit");
  const revisions = await listRevisionsByRetrofit({ retrofitId: id });
  return Response.json({ ...detail, revisions });
});

export const PATCH = apiRoute<P>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Retrofit");
  const input = updateRetrofitSchema.parse(await readJson(req));
  const user = await requireUser({ roles: EDIT, req });
  await updateRetrofit({ id, input, userId: user.id });
  const detail = await getRetrofitDetail({ id });
  return Response.json(detail);
});

export const DELETE = apiRoute<P>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Retrofit");
  const user = await requireUser({ roles: EDIT, req });
  const retrofit = await archiveRetrofit({ id, userId: user.id });
  return Response.json({ retrofit });
});
