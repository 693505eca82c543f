// Sign-in throttling: growing delays, never a hard lock (common practice, no
// source for the numbers). Three counters, each one row in sign_in_counters:
//   pair    (e-mail and client address): 5 free attempts, then 30 s, 60 s,
//           120 s ... at most 15 min. Guessing one account from one place.
//   address (client address): 100 free, then 1 s doubling to 15 min.
//           Spraying one password over many accounts.
//   account (e-mail, any address): 20 free, then 1 s doubling to 60 s.
//           Guessing one account from many places; capped low so that a
//           stranger elsewhere can slow a user down by a minute at most.
// NIST SP 800-63B section 5.2.2 asks for at most 100 consecutive failed
// attempts per account (from memory); these limits stay well below it.
//
// An attempt is claimed before the password is checked, one counter at a
// time, each by a single INSERT ... ON CONFLICT DO UPDATE ... RETURNING: the
// row lock of the upsert orders parallel attempts, so 20 at once get the
// numbers 1..20 and only those the rule lets through reach bcrypt (no
// read-then-write race). A refused attempt leaves its counter as it was, and
// the later counters are not touched, so hammering from one address does not
// lengthen anyone else's wait. A counter starts again 15 min after its last
// allowed attempt. A good password clears pair and account and gives the
// address its attempt back.
//
// The client address is the last X-Forwarded-For entry: the hop nearest this
// server (our reverse proxy, or Next.js itself, which sets the socket address
// when the header is absent). Exposed without a reverse proxy, a client can
// forge that header and dodge the address counter; pair and account still hold.
import { eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { signInCounters } from "@/db/schema";

type Rule = { free: number; baseS: number; capS: number };

export const THROTTLE_RULES = {
  pair: { free: 5, baseS: 30, capS: 900 },
  address: { free: 100, baseS: 1, capS: 900 },
  account: { free: 20, baseS: 1, capS: 60 },
} as const satisfies Record<string, Rule>;

export const THROTTLE_WINDOW_S = 900;

export type CounterKind = keyof typeof THROTTLE_RULES;

export function counterKey(kind: CounterKind, email: string, address: string): string {
  if (kind === "pair") return `pair:${email} ${address}`;
  return kind === "account" ? `account:${email}` : `address:${address}`;
}

/** Seconds to wait after the n-th attempt of a window, as SQL over the expression `n`. */
function delaySql(n: ReturnType<typeof sql>, rule: Rule) {
  return sql`(case when ${n} < ${rule.free} then 0 else least(${rule.capS}::float8, ${rule.baseS}::float8 * power(2::float8, (${n} - ${rule.free})::float8)) end) * interval '1 second'`;
}

/** Claims one attempt on one counter: null when allowed, else the time the next attempt may come. */
async function claim(key: string, rule: Rule): Promise<Date | null> {
  const c = signInCounters;
  const fresh = sql`(${c.lastAt} < now() - ${THROTTLE_WINDOW_S} * interval '1 second')`;
  // now() is the statement's start, taken before it waits for the row lock, so
  // it can be earlier than the next_at a statement ahead of it just wrote: the
  // free attempts are therefore counted, not timed.
  const allowed = sql`(${fresh} or ${c.attempts} < ${rule.free} or ${c.nextAt} <= now())`;
  const n = sql`(case when ${fresh} then 1 when ${allowed} then ${c.attempts} + 1 else ${c.attempts} end)`;
  const [row] = await db
    .insert(c)
    .values({
      key,
      attempts: 1,
      lastAt: sql`now()`,
      nextAt: sql`now() + ${delaySql(sql`1`, rule)}`,
      lastAllowed: true,
    })
    .onConflictDoUpdate({
      target: c.key,
      set: {
        attempts: n,
        nextAt: sql`case when ${allowed} then now() + ${delaySql(n, rule)} else ${c.nextAt} end`,
        lastAt: sql`case when ${allowed} then now() else ${c.lastAt} end`,
        lastAllowed: allowed,
      },
    })
    .returning({ allowed: c.lastAllowed, nextAt: c.nextAt });
  return row.allowed ? null : row.nextAt;
}

/**
 * Claims a sign-in attempt for this e-mail from this address. Returns 0 when
 * the password may be checked, else the whole seconds to wait.
 */
export async function claimSignInAttempt(email: string, address: string): Promise<number> {
  for (const kind of ["pair", "address", "account"] as const) {
    const until = await claim(counterKey(kind, email, address), THROTTLE_RULES[kind]);
    if (until) return Math.max(1, Math.ceil((until.getTime() - Date.now()) / 1000));
  }
  return 0;
}

/** A good password: the account's counters start again and the address gets its attempt back. */
export async function recordSignInSuccess(email: string, address: string): Promise<void> {
  const c = signInCounters;
  await db.delete(c).where(eq(c.key, counterKey("pair", email, address)));
  await db.delete(c).where(eq(c.key, counterKey("account", email, address)));
  await db
    .update(c)
    .set({ attempts: sql`greatest(${c.attempts} - 1, 0)` })
    .where(eq(c.key, counterKey("address", email, address)));
}

/** The client address of a request's headers (see the note at the top). */
export function clientAddress(headers: Record<string, unknown> | Headers | undefined): string {
  const raw =
    headers instanceof Headers ? headers.get("x-forwarded-for") : (headers?.["x-forwarded-for"] as unknown);
  const text = typeof raw === "string" ? raw : Array.isArray(raw) ? String(raw[raw.length - 1]) : "";
  const last = text.split(",").pop()?.trim() ?? "";
  const address = last.replace(/^::ffff:(?=\d+\.\d+\.\d+\.\d+$)/, "");
  return /^[0-9A-Za-z.:[\]%-]{1,64}$/.test(address) ? address : "unknown";
}
