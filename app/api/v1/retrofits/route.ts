// GET /api/v1/retrofits: the table (search, filters, sort, pages in SQL).
// POST /api/v1/retrofits: a new retrofit with optional stage and targets.
import { apiRoute, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { EDIT, READ_ALL } from "@/lib/auth/roles";
import { listRetrofitSites, listRetrofits } from "@/lib/retrofits/list";
import { createRetrofit } from "@/lib/retrofits/mutate";
import { createRetrofitSchema, listQuerySchema } from "@/lib/validation/workspace";

export const GET = apiRoute(async (req) => {
  const params = Object.fromEntries([...new URL(req.url).searchParams].filter(([, v]) => v !== ""));
  const query = listQuerySchema.parse(params);
  await requireUser({ roles: READ_ALL, req });
  const [{ items, total }, sites] = await Promise.all([listRetrofits(query), listRetrofitSites()]);
  return Response.json({ items, total, page: query.page, pageSize: query.pageSize, sites });
});

export const POST = apiRoute(async (req) => {
  const input = createRetrofitSchema.parse(await readJson(req));
  const user = await requireUser({ roles: EDIT, req });
  const retrofit = await createRetrofit({ input, userId: user.id });
  return Response.json(
    { retrofit },
    { status: 201, headers: { location: `/api/v1/retrofits/${retrofit.id}` } },
  );
});
