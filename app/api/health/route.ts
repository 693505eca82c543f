import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { apiRoute } from "@/lib/api/route";

// Liveness and database reachability, for scripts and the test runner.
export const GET = apiRoute(async () => {
  await db.execute(sql`select 1`);
  return Response.json({ ok: true });
});
