// Secrets never reach the server log: after the whole run (this file runs in
// the serial step, after every other test), the log of the server under test
// holds neither NEXTAUTH_SECRET, nor an API token secret used against it, nor
// a password sent to sign-in. Log: SERVER_LOG, else .data/run/dev-<name>.log
// for a private dev server (NEXT_DIST_DIR=.next-<name>).
import { existsSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { BASE_URL, Session, signedIn } from "../helpers/server";
import { makeUser, TEST_PASSWORD } from "../helpers/users";

function logPath(): string {
  if (process.env.SERVER_LOG) return process.env.SERVER_LOG;
  const name = /^\.next-(.+)$/.exec(process.env.NEXT_DIST_DIR ?? "")?.[1];
  return name ? `.data/run/dev-${name}.log` : ".data/run/test-server.log";
}

describe("server log", () => {
  it("holds no session secret, token secret or password", { timeout: 120_000 }, async () => {
    const secret = process.env.NEXTAUTH_SECRET;
    expect(secret, "NEXTAUTH_SECRET must be set for this test").toBeTruthy();
    const u = await makeUser("engineer");
    const s = await signedIn(u.email, TEST_PASSWORD);
    const made = await s.json<{ token: { secret: string } }>("/api/v1/tokens", {
      method: "POST",
      body: { name: "log probe" },
    });
    expect(made.status).toBe(201);
    const token = made.body.token.secret;
    // Use it, well and badly, so a careless log line would have something to print.
    await fetch(`${BASE_URL}/api/v1/retrofits`, { headers: { authorization: `Bearer ${token}` } });
    await fetch(`${BASE_URL}/api/v1/plan`, {
      method: "POST",
      headers: { authorization: `Bearer ${token}` },
      body: "{bad",
    });
    const wrong = "wrong-password-log-probe-7731";
    await new Session().signIn(u.email, wrong);

    const path = logPath();
    expect(existsSync(path), `server log ${path}`).toBe(true);
    await new Promise((r) => setTimeout(r, 500));
    const log = readFileSync(path, "latin1");
    expect(log.length).toBeGreaterThan(0);
    expect(log.includes(secret!), "NEXTAUTH_SECRET in the log").toBe(false);
    expect(log.includes(token), "an API token secret in the log").toBe(false);
    expect(log.includes(wrong), "a sign-in password in the log").toBe(false);
    expect(log.includes(TEST_PASSWORD), "the test users' password in the log").toBe(false);
  });
});
