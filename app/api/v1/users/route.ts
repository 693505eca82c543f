import { asc } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { apiRoute } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ADMIN } from "@/lib/auth/roles";

// GET /api/v1/users: every account (admins only); never the password hash.
export const GET = apiRoute(async (req) => {
  await requireUser({ roles: ADMIN, req });
  const rows = await db
    .select({
      id: users.id,
      email: users.email,
      name: users.name,
      role: users.role,
      site: users.site,
      disabled: users.disabled,
    })
    .from(users)
    .orderBy(asc(users.id));
  return Response.json({ users: rows });
});
