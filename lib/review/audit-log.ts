// Reading the audit log with filters (action, actor, date range), newest first,
// for the admins' audit page and GET /api/v1/audit.
import "server-only";
import { and, desc, eq, gte, lt, sql, type SQL } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { dbIdText } from "@/lib/validation/id";
import { optionalPlainNumber } from "@/lib/validation/plain-number";
import { auditEvents, users } from "@/db/schema";

const day = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Use YYYY-MM-DD.")
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), "Not a date.")
  // PostgreSQL timestamps have no year 0 (documentation, "Date/Time Types":
  // years count 1 BC, 1 AD), and the audit log starts long after 1970.
  .refine((s) => Number(s.slice(0, 4)) >= 1970, "Use a year from 1970 on.");

export const auditFilter = z.object({
  action: z
    .string()
    .trim()
    .max(80)
    .optional()
    .transform((s) => s || undefined),
  actor: dbIdText.optional().or(z.literal("").transform(() => undefined)),
  from: day.optional().or(z.literal("").transform(() => undefined)),
  to: day.optional().or(z.literal("").transform(() => undefined)),
  page: z._default(
    optionalPlainNumber(
      "page is a whole number from 1",
      z
        .number()
        .int("page is a whole number.")
        .min(1, "page starts at 1.")
        .max(10000, "page is at most 10000."),
    ),
    1,
  ),
});

export type AuditFilter = z.infer<typeof auditFilter>;
export const AUDIT_PAGE_SIZE = 100;

function where(f: AuditFilter): SQL | undefined {
  const parts: SQL[] = [];
  if (f.action) parts.push(eq(auditEvents.action, f.action));
  if (f.actor) parts.push(eq(auditEvents.actorId, f.actor));
  if (f.from) parts.push(gte(auditEvents.createdAt, new Date(`${f.from}T00:00:00Z`)));
  // "to" is inclusive: everything before the start of the next day (UTC).
  if (f.to) parts.push(lt(auditEvents.createdAt, new Date(Date.parse(`${f.to}T00:00:00Z`) + 86_400_000)));
  return parts.length ? and(...parts) : undefined;
}

export async function readAudit(f: AuditFilter) {
  const rows = await db
    .select({
      id: auditEvents.id,
      createdAt: auditEvents.createdAt,
      action: auditEvents.action,
      actorId: auditEvents.actorId,
      actor: users.name,
      actorEmail: users.email,
      subjectType: auditEvents.subjectType,
      subjectId: auditEvents.subjectId,
      details: auditEvents.details,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(where(f))
    .orderBy(desc(auditEvents.createdAt), desc(auditEvents.id))
    .limit(AUDIT_PAGE_SIZE + 1)
    .offset((f.page - 1) * AUDIT_PAGE_SIZE);
  return { events: rows.slice(0, AUDIT_PAGE_SIZE), more: rows.length > AUDIT_PAGE_SIZE };
}

export async function auditActions(): Promise<string[]> {
  const rows = await db
    .selectDistinct({ action: auditEvents.action })
    .from(auditEvents)
    .orderBy(sql`1`);
  return rows.map((r) => r.action);
}
