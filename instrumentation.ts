// Runs once when the server starts: validates the environment (a bad or
// missing variable stops the server with a message naming it), then retries
// unsent mail every 30 s, so a mail server outage delays messages but never
// loses them.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { env } = await import("@/lib/env");
  env();
  const { flushOutbox } = await import("@/lib/mail/outbox");
  const timer = setInterval(() => {
    flushOutbox().catch((err) => console.error("mail retry failed:", err));
  }, 30_000);
  timer.unref();
}
