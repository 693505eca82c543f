// The audit log: who did what, when. Written in the same transaction as the
// change it records where there is one.
import { db, type Tx } from "@/db/client";
import { auditEvents } from "@/db/schema";

export type AuditInput = {
  actorId: number | null;
  action: string;
  subjectType?: string;
  subjectId?: number;
  details?: Record<string, unknown>;
};

export async function recordAudit(input: AuditInput, tx?: Tx): Promise<void> {
  await (tx ?? db).insert(auditEvents).values({
    actorId: input.actorId,
    action: input.action,
    subjectType: input.subjectType ?? null,
    subjectId: input.subjectId ?? null,
    details: input.details ?? {},
  });
}
