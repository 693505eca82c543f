// Runs once when the server starts: retries unsent mail every 30 s, so a mail
// server outage delays messages but never loses them.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { flushOutbox } = await import("@/lib/mail/outbox");
  const timer = setInterval(() => {
    flushOutbox().catch((err) => console.error("mail retry failed:", err));
  }, 30_000);
  timer.unref();
}
