// Runs once when the server starts: validates the environment (a bad or
// missing variable stops the server with a message naming it). Mail retries
// belong to the job queue (scripts/worker.ts), not to the web server.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { env } = await import("@/lib/env");
  env();
}
