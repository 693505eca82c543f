// Server-side end of sessions. Session cookies are signed JWTs the server
// cannot recall, so each carries the user's session_version from sign-in and
// its sign-in time; guard.ts accepts a cookie only while the version still
// matches and the absolute lifetime has not run out.
import { eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { SESSION_ABSOLUTE_S } from "./options";

type Tx = Pick<typeof db, "update">;

/** Every session of this user stops working at its next request. */
export async function endSessions(userId: number, tx: Tx = db): Promise<void> {
  await tx
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId));
}

/** Whether a session cookie with this version and sign-in time is still good for this user row. */
export function sessionStillValid(
  row: { sessionVersion: number },
  claims: { sv?: unknown; authAt?: unknown },
  now = Date.now(),
): boolean {
  if (typeof claims.sv !== "number" || typeof claims.authAt !== "number") return false;
  if (claims.sv !== row.sessionVersion) return false;
  return now - claims.authAt < SESSION_ABSOLUTE_S * 1000 && claims.authAt <= now + 60_000;
}
