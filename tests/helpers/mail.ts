// Reads what the local mail catcher that scripts/test.sh runs has received.
import { mailHttpUrl } from "./ports";

export const MAIL_URL = mailHttpUrl();

export type CaughtMail = { id: string; from: string; to: string[]; subject: string; text: string };

export async function caughtMail(): Promise<CaughtMail[]> {
  const res = await fetch(`${MAIL_URL}/messages.json`);
  return (await res.json()) as CaughtMail[];
}

/** Waits until a message to `to` whose subject matches arrives (mail is sent after the action commits). */
export async function waitForMail(to: string, subject: RegExp, timeoutMs = 15_000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const hit = (await caughtMail()).find((m) => m.to.includes(to) && subject.test(m.subject));
    if (hit) return hit;
    if (Date.now() > until) throw new Error(`no mail to ${to} matching ${subject} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
}
