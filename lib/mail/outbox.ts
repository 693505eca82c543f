// Outgoing mail. Every message is written to mail_outbox (the record of what
// was sent, and why not) and a mail-send job is queued, both in the same
// transaction as the action that causes it, when there is one. A worker
// (scripts/worker.ts) sends it over SMTP; a failed send is retried by the job
// queue, so the action itself never fails or is lost because mail is down.
import { and, eq, isNull } from "drizzle-orm";
import nodemailer from "nodemailer";
import { db, type Tx } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { env } from "@/lib/env";
import { sendJob } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";

export type MailKind =
  "review-requested" | "review-decision" | "revision-released" | "invitation" | "field-check-failed";

export type OutgoingMail = { kind: MailKind; to: string; subject: string; body: string };

export type SendMailJob = { outboxIds: number[] };

export async function enqueueMail(messages: OutgoingMail[], tx?: Tx): Promise<void> {
  if (!messages.length) return;
  const write = async (t: Tx) => {
    const rows = await t
      .insert(mailOutbox)
      .values(messages.map((m) => ({ kind: m.kind, toAddress: m.to, subject: m.subject, body: m.body })))
      .returning({ id: mailOutbox.id });
    await sendJob(QUEUES.sendMail, { outboxIds: rows.map((r) => r.id) } satisfies SendMailJob, t);
  };
  await (tx ? write(tx) : db.transaction(write));
}

let transport: nodemailer.Transporter | undefined;
function smtp(): nodemailer.Transporter {
  const e = env();
  transport ??= nodemailer.createTransport({
    host: e.SMTP_HOST,
    port: e.SMTP_PORT,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
  });
  return transport;
}

/**
 * The mail-send job. Each row is locked and marked sent in one transaction, so
 * a retried job (or a second worker) never sends a row twice; a failure throws
 * after recording the error, and the queue retries the rows still unsent.
 */
export async function sendOutboxRows({ outboxIds }: SendMailJob): Promise<number> {
  let sent = 0;
  const failures: string[] = [];
  for (const id of outboxIds) {
    await db.transaction(async (tx) => {
      const [m] = await tx
        .select()
        .from(mailOutbox)
        .where(and(eq(mailOutbox.id, id), isNull(mailOutbox.sentAt)))
        .for("update", { skipLocked: true });
      if (!m) return;
      try {
        await smtp().sendMail({ from: env().MAIL_FROM, to: m.toAddress, subject: m.subject, text: m.body });
        await tx
          .update(mailOutbox)
          .set({ sentAt: new Date(), attempts: m.attempts + 1 })
          .where(eq(mailOutbox.id, m.id));
        sent += 1;
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        failures.push(`mail ${m.id} to ${m.toAddress}: ${message}`);
        await tx
          .update(mailOutbox)
          .set({ attempts: m.attempts + 1, lastError: message })
          .where(eq(mailOutbox.id, m.id));
      }
    });
  }
  if (failures.length) throw new Error(`Not sent (the queue retries): ${failures.join("; ")}`);
  return sent;
}
