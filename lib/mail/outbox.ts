// Outgoing mail. Every message is first written to mail_outbox (in the same
// transaction as the action that causes it, when there is one), then sent over
// SMTP to the configured server: the local catcher in development and tests.
// A failed send is logged and retried later; the action itself never fails
// or is lost because mail is down.
import { and, asc, eq, isNull, lt, notInArray } from "drizzle-orm";
import nodemailer from "nodemailer";
import { db, type Tx } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { env } from "@/lib/env";

export type MailKind =
  "review-requested" | "review-decision" | "revision-released" | "invitation" | "field-check-failed";

export type OutgoingMail = { kind: MailKind; to: string; subject: string; body: string };

const MAX_ATTEMPTS = 10;

export async function enqueueMail(messages: OutgoingMail[], tx?: Tx): Promise<void> {
  if (!messages.length) return;
  await (tx ?? db)
    .insert(mailOutbox)
    .values(messages.map((m) => ({ kind: m.kind, toAddress: m.to, subject: m.subject, body: m.body })));
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
let again = false;

/**
 * Sends what is waiting; resolves with how many were sent. One flush runs at a
 * time per process; a call during a flush makes it go round once more, so a
 * message committed meanwhile is not left for the retry timer.
 */
export function flushOutbox(): Promise<number> {
  if (flushing) {
    again = true;
    return flushing;
  }
  flushing = (async () => {
    let sent = 0;
    do {
      again = false;
      sent += await sendPending();
    } while (again);
    return sent;
  })().finally(() => {
    flushing = null;
  });
  return flushing;
}

// Each message is claimed with FOR UPDATE SKIP LOCKED and marked in the same
// transaction, so two processes (or the timer and a request) never send the
// same row twice. A row that fails is not retried within the same flush.
async function sendPending(): Promise<number> {
  const tried: number[] = [];
  let sent = 0;
  for (;;) {
    const outcome = await db.transaction(async (tx) => {
      const [m] = await tx
        .select()
        .from(mailOutbox)
        .where(
          and(
            isNull(mailOutbox.sentAt),
            lt(mailOutbox.attempts, MAX_ATTEMPTS),
            tried.length ? notInArray(mailOutbox.id, tried) : undefined,
          ),
        )
        .orderBy(asc(mailOutbox.id))
        .limit(1)
        .for("update", { skipLocked: true });
      if (!m) return "none" as const;
      tried.push(m.id);
      try {
        await smtp().sendMail({ from: env().MAIL_FROM, to: m.toAddress, subject: m.subject, text: m.body });
        await tx
          .update(mailOutbox)
          .set({ sentAt: new Date(), attempts: m.attempts + 1 })
          .where(eq(mailOutbox.id, m.id));
        return "sent" as const;
      } catch (err) {
        const message = err instanceof Error ? err.message : String(err);
        console.error(`mail ${m.id} to ${m.toAddress} not sent (attempt ${m.attempts + 1}): ${message}`);
        await tx
          .update(mailOutbox)
          .set({ attempts: m.attempts + 1, lastError: message })
          .where(eq(mailOutbox.id, m.id));
        return "failed" as const;
      }
    });
    if (outcome === "none") return sent;
    if (outcome === "sent") sent += 1;
  }
}

/** Fire-and-forget send after an action has committed. */
export function kickOutbox(): void {
  flushOutbox().catch((err) => console.error("mail outbox flush failed:", err));
}
