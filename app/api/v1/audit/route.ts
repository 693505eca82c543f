import { apiRoute } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ADMIN } from "@/lib/auth/roles";
import { auditFilter, readAudit } from "@/lib/review/audit-log";

// GET /api/v1/audit?action=&actor=<userId>&from=YYYY-MM-DD&to=YYYY-MM-DD&page=
// (admins): audit events newest first, 100 a page; `more` says a next page exists.
export const GET = apiRoute(async (req) => {
  const filter = auditFilter.parse(Object.fromEntries(new URL(req.url).searchParams));
  await requireUser({ roles: ADMIN, req });
  return Response.json(await readAudit(filter));
});
