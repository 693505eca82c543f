// Sign-in throttling per e-mail address: after MAX_FAILURES wrong passwords
// within WINDOW_MS the address is locked for LOCK_MS (common practice, no source).
import { eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { signInFailures } from "@/db/schema";

export const MAX_FAILURES = 5;
const WINDOW_MS = 15 * 60_000;
const LOCK_MS = 15 * 60_000;

export async function lockedUntil(email: string): Promise<Date | null> {
  const [row] = await db.select().from(signInFailures).where(eq(signInFailures.email, email));
  if (!row?.lockedUntil || row.lockedUntil.getTime() <= Date.now()) return null;
  return row.lockedUntil;
}

export async function recordFailure(email: string): Promise<void> {
  const windowStart = new Date(Date.now() - WINDOW_MS);
  const lock = new Date(Date.now() + LOCK_MS);
  await db
    .insert(signInFailures)
    .values({ email, count: 1, firstAt: new Date() })
    .onConflictDoUpdate({
      target: signInFailures.email,
      set: {
        count: sql`case when ${signInFailures.firstAt} < ${windowStart} then 1 else ${signInFailures.count} + 1 end`,
        firstAt: sql`case when ${signInFailures.firstAt} < ${windowStart} then now() else ${signInFailures.firstAt} end`,
        lockedUntil: sql`case when ${signInFailures.firstAt} >= ${windowStart} and ${signInFailures.count} + 1 >= ${MAX_FAILURES} then ${lock} else ${signInFailures.lockedUntil} end`,
      },
    });
}

export async function clearFailures(email: string): Promise<void> {
  await db.delete(signInFailures).where(eq(signInFailures.email, email));
}
