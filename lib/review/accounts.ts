// User administration (admins): role, site and disabled changes, each with an
// audit event in the same transaction. An admin cannot change their own role
// or disable themselves, so the last admin cannot lock everyone out.
import "server-only";
import { and, eq, isNull } from "drizzle-orm";
import { z } from "zod";
import { lineText } from "@/lib/validation/plain-text";
import { db } from "@/db/client";
import { apiTokens, users } from "@/db/schema";
import { ApiError, notFound } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { AuthUser } from "@/lib/auth/guard";
import { ROLES } from "@/lib/auth/roles";

export const userChange = z
  .object({
    role: z.enum(ROLES).optional(),
    // Empty or null = every site.
    site: z.nullish(lineText("Site", { max: 200 })).transform((s) => (s ? s : null)),
    disabled: z.boolean().optional(),
  })
  .strict();

export type UserChange = z.input<typeof userChange>;

export async function changeUser(admin: AuthUser, userId: number, raw: unknown) {
  const input = userChange.parse(raw);
  const siteGiven = raw !== null && typeof raw === "object" && "site" in raw;
  return db.transaction(async (tx) => {
    const [before] = await tx.select().from(users).where(eq(users.id, userId)).for("update");
    if (!before) throw notFound("User");
    if (userId === admin.id && ((input.role && input.role !== before.role) || input.disabled === true)) {
      throw new ApiError(
        "forbidden",
        "You cannot change your own role or disable yourself; ask another admin.",
      );
    }
    const set: Partial<typeof users.$inferInsert> = {};
    const events: { action: string; details: Record<string, unknown> }[] = [];
    if (input.role && input.role !== before.role) {
      set.role = input.role;
      events.push({ action: "user.role-change", details: { from: before.role, to: input.role } });
    }
    if (siteGiven && input.site !== before.site) {
      set.site = input.site;
      events.push({ action: "user.site-change", details: { from: before.site, to: input.site } });
    }
    if (input.disabled !== undefined && input.disabled !== before.disabled) {
      set.disabled = input.disabled;
      events.push({ action: input.disabled ? "user.disable" : "user.enable", details: {} });
    }
    if (events.length === 0) return publicUser(before);
    // Disabling or re-enabling ends every session and token the user had, so
    // re-enabling revives none of them (issue 15 point 4).
    if (set.disabled !== undefined) {
      set.sessionVersion = before.sessionVersion + 1;
      await tx
        .update(apiTokens)
        .set({ revokedAt: new Date() })
        .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)));
    }
    const [after] = await tx.update(users).set(set).where(eq(users.id, userId)).returning();
    for (const e of events) {
      await recordAudit(
        {
          actorId: admin.id,
          action: e.action,
          subjectType: "user",
          subjectId: userId,
          details: { ...e.details, email: before.email },
        },
        tx,
      );
    }
    return publicUser(after);
  });
}

export function publicUser(u: typeof users.$inferSelect) {
  return { id: u.id, email: u.email, name: u.name, role: u.role, site: u.site, disabled: u.disabled };
}
