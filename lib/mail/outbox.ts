// Outgoing mail. Every message is first written to mail_outbox (in the same
// transaction as the action that causes it, when there is one), then sent over
// SMTP to the configured server: the local catcher in development and tests.
// A failed send is logged and retried later; the action itself never fails
// or is lost because mail is down.
import { and, asc, eq, isNull, lt } from "drizzle-orm";
import nodemailer from "nodemailer";
import { db, type Tx } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { env } from "@/lib/env";

export type MailKind = "review-requested" | "review-decision" | "revision-approved" | "invitation" | "field-check-failed";

export type OutgoingMail = { kind: MailKind; to: string; subject: string; body: string };

const MAX_ATTEMPTS = 10;

export async function enqueueMail(messages: OutgoingMail[], tx?: Tx): Promise<void> {
  if (!messages.length) return;
  await (tx ?? db).insert(mailOutbox).values(
    messages.map((m) => ({ kind: m.kind, toAddress: m.to, subject: m.subject, body: m.body })),
  );
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

let flushing: Promise<number> | null = null;

/** Sends what is waiting; returns how many were sent. Runs one at a time. */
export function flushOutbox(): Promise<number> {
  flushing ??= sendPending().finally(() => {
    flushing = null;
  });
  return flushing;
}

async function sendPending(): Promise<number> {
  const pending = await db
    .select()
    .from(mailOutbox)
    .where(and(isNull(mailOutbox.sentAt), lt(mailOutbox.attempts, MAX_ATTEMPTS)))
    .orderBy(asc(mailOutbox.id))
    .limit(50);
  let sent = 0;
  for (const m of pending) {
    try {
      await smtp().sendMail({ from: env().MAIL_FROM, to: m.toAddress, subject: m.subject, text: m.body });
      await db.update(mailOutbox).set({ sentAt: new Date(), attempts: m.attempts + 1 }).where(eq(mailOutbox.id, m.id));
      sent += 1;
    } catch (err) {
      const message = err instanceof Error ? err.message : String(err);
      console.error(`mail ${m.id} to ${m.toAddress} not sent (attempt ${m.attempts + 1}): ${message}`);
      await db
        .update(mailOutbox)
        .set({ attempts: m.attempts + 1, lastError: message })
        .where(eq(mailOutbox.id, m.id));
    }
  }
  return sent;
}

/** Fire-and-forget send after an action has committed. */
export function kickOutbox(): void {
  flushOutbox().catch((err) => console.error("mail outbox flush failed:", err));
}
