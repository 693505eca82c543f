// Sends queued mail right after a commit. flushOutbox() hands back a flush that
// may already be running and may have read the outbox before our rows were
// committed; a second flush after it picks them up, so a message never waits
// for the 30 s retry timer just because another send was in progress.
import "server-only";
import { flushOutbox } from "@/lib/mail/outbox";

export function sendSoon(): void {
  flushOutbox()
    .then(() => flushOutbox())
    .catch((err) => console.error("mail outbox flush failed:", err));
}
