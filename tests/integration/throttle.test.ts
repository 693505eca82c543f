// Sign-in throttling (lib/auth/throttle.ts) against the running server and its
// database. Each test signs in from its own made-up client address (the
// X-Forwarded-For hop, as a reverse proxy sets it) so that it neither depends on
// nor blocks the loopback address the other test files sign in from.
// The limits are our own (common practice, no source); the checks are that
// parallel attempts cannot get past them (the counter is claimed atomically
// before bcrypt runs) and that a stranger elsewhere cannot lock a user out.
import { randomBytes } from "node:crypto";
import { and, eq, like, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { auditEvents, signInCounters } from "@/db/schema";
import { SIGN_IN_ERRORS } from "@/lib/auth/options";
import { claimSignInAttempt, THROTTLE_RULES } from "@/lib/auth/throttle";
import { BASE_URL } from "../helpers/server";
import { makeUser, TEST_PASSWORD } from "../helpers/users";

/** A documentation-range address (RFC 5737, 198.51.100.0/24) unique to this run. */
const address = () => `198.51.100.${1 + (randomBytes(1)[0] % 250)}-${randomBytes(3).toString("hex")}`;

/** A sign-in form as the page holds it (csrf cookie and token), from client address `from`. */
async function prepare(from: string) {
  const csrfRes = await fetch(`${BASE_URL}/api/auth/csrf`, { headers: { "x-forwarded-for": from } });
  const cookie = csrfRes.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  /** Sends the form; the error text next-auth returns, or null when signed in. */
  return async (email: string, password: string): Promise<string | null> => {
    const res = await fetch(`${BASE_URL}/api/auth/callback/credentials`, {
      method: "POST",
      redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie, "x-forwarded-for": from },
      body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
    });
    const { url } = (await res.json()) as { url: string };
    return new URL(url).searchParams.get("error");
  };
}

async function signInFrom(from: string, email: string, password: string): Promise<string | null> {
  return (await prepare(from))(email, password);
}

/** n sign-ins sent together: every form is fetched first, then all are posted at once. */
async function burst(n: number, from: string, email: (i: number) => string, password: (i: number) => string) {
  const forms = await Promise.all(Array.from({ length: n }, () => prepare(from)));
  return Promise.all(forms.map((send, i) => send(email(i), password(i))));
}

async function checkedFailures(email: string): Promise<number> {
  const rows = await db
    .select({ id: auditEvents.id })
    .from(auditEvents)
    .where(and(eq(auditEvents.action, "sign-in-failed"), sql`${auditEvents.details}->>'email' = ${email}`));
  return rows.length;
}

describe("sign-in throttling", () => {
  it("20 parallel wrong passwords: at most the free attempts reach the password check", async () => {
    const u = await makeUser("engineer");
    const from = address();
    const errors = await burst(
      20,
      from,
      () => u.email,
      (i) => `wrong-${i}-password`,
    );
    const checked = errors.filter((e) => e === SIGN_IN_ERRORS.invalid).length;
    const waited = errors.filter((e) => /^Too many failed attempts\. Wait \d+ seconds?/.test(e ?? "")).length;
    expect(checked + waited, JSON.stringify(errors)).toBe(20);
    expect(checked).toBe(THROTTLE_RULES.pair.free);
    // The audit holds one "sign-in-failed" per checked password: none slipped past.
    expect(await checkedFailures(u.email)).toBe(THROTTLE_RULES.pair.free);
    // Now even the right password waits, from that address.
    expect(await signInFrom(from, u.email, TEST_PASSWORD)).toMatch(/^Too many failed attempts/);
  });

  it("a stranger hammering from elsewhere does not lock the user out", async () => {
    const u = await makeUser("technician");
    const stranger = address();
    await burst(
      20,
      stranger,
      () => u.email,
      (i) => `guess-${i}-xx`,
    );
    // The user, from their own address, gets in at once.
    expect(await signInFrom(address(), u.email, TEST_PASSWORD)).toBeNull();
    // The stranger's wait is bounded by the pair rule's cap, never a lock.
    const [row] = await db
      .select()
      .from(signInCounters)
      .where(eq(signInCounters.key, `pair:${u.email} ${stranger}`));
    expect(row.nextAt.getTime() - Date.now()).toBeLessThanOrEqual(THROTTLE_RULES.pair.capS * 1000);
    expect(row.nextAt.getTime()).toBeGreaterThan(Date.now());
  });

  // The address rule allows 100 free attempts; through HTTP that is minutes of
  // bcrypt on the shared test machine, so the claim itself is run here, 110
  // at once against the test database, exactly as authorize() runs it.
  it("one address spraying one password over many accounts is slowed after the free attempts", async () => {
    const from = address();
    const tag = randomBytes(3).toString("hex");
    const waits = await Promise.all(
      Array.from({ length: THROTTLE_RULES.address.free + 10 }, (_, i) =>
        claimSignInAttempt(`spray-${tag}-${i}@test.invalid`, from),
      ),
    );
    expect(waits.filter((s) => s === 0)).toHaveLength(THROTTLE_RULES.address.free);
    expect(waits.filter((s) => s > 0)).toHaveLength(10);
    // The server counts its sign-ins on that same address row (the wiring).
    const key = `address:${from}`;
    const before = (await db.select().from(signInCounters).where(eq(signInCounters.key, key)))[0];
    await new Promise((r) => setTimeout(r, Math.max(0, before.nextAt.getTime() - Date.now()) + 50));
    expect(await signInFrom(from, `spray-${tag}-x@test.invalid`, "Summer2026!")).toBe(SIGN_IN_ERRORS.invalid);
    const after = (await db.select().from(signInCounters).where(eq(signInCounters.key, key)))[0];
    expect(after.attempts).toBe(before.attempts + 1);
  });

  it("the claim is atomic: 50 at once on one account and address, exactly the free ones pass", async () => {
    const email = `claim-${randomBytes(3).toString("hex")}@test.invalid`;
    const waits = await Promise.all(Array.from({ length: 50 }, () => claimSignInAttempt(email, address())));
    // 50 different addresses: the pair and address rules pass each once; the account rule decides.
    expect(waits.filter((s) => s === 0)).toHaveLength(THROTTLE_RULES.account.free);
    for (const s of waits.filter((x) => x > 0)) expect(s).toBeLessThanOrEqual(THROTTLE_RULES.account.capS);
  });

  it("a disabled account answers the same with the right and a wrong password", async () => {
    const u = await makeUser("reviewer", { disabled: true });
    const right = await signInFrom(address(), u.email, TEST_PASSWORD);
    const wrong = await signInFrom(address(), u.email, "not-the-password");
    const unknown = await signInFrom(
      address(),
      `nobody-${randomBytes(3).toString("hex")}@test.invalid`,
      "x-pass",
    );
    expect(right).toBe(SIGN_IN_ERRORS.invalid);
    expect(wrong).toBe(right);
    expect(unknown).toBe(right);
  });

  it("a good password starts the account's counters again", async () => {
    const u = await makeUser("engineer");
    const from = address();
    for (let i = 0; i < THROTTLE_RULES.pair.free - 1; i++) await signInFrom(from, u.email, `wrong-${i}-x`);
    expect(await signInFrom(from, u.email, TEST_PASSWORD)).toBeNull();
    const rows = await db
      .select()
      .from(signInCounters)
      .where(like(signInCounters.key, `%${u.email}%`));
    expect(rows).toHaveLength(0);
  });
});
