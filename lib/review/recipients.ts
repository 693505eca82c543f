// Who gets which message: active reviewers (never the author), and active
// technicians of the retrofit's site or of every site (site null).
import "server-only";
import { and, eq, isNull, ne, or } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { users } from "@/db/schema";

const person = { name: users.name, email: users.email };

export function activeReviewers(tx: Tx, exceptUserId: number) {
  return tx
    .select(person)
    .from(users)
    .where(and(eq(users.role, "reviewer"), eq(users.disabled, false), ne(users.id, exceptUserId)));
}

export function techniciansOfSite(tx: Tx, site: string) {
  return tx
    .select(person)
    .from(users)
    .where(
      and(
        eq(users.role, "technician"),
        eq(users.disabled, false),
        or(isNull(users.site), eq(users.site, site)),
      ),
    );
}
