// Revision numbers under concurrent generation: the retrofit row is locked, so
// simultaneous requests get unique, gapless numbers 1..n.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { makeToken, makeUser } from "../../helpers/users";
import { jsonClient, newRetrofitBody, type JsonClient } from "./fixtures";

async function newRetrofit(api: JsonClient): Promise<number> {
  const res = await api("/api/v1/retrofits", { method: "POST", body: newRetrofitBody() });
  return ((await res.json()) as { retrofit: { id: number } }).retrofit.id;
}

async function storedNumbers(retrofitId: number): Promise<number[]> {
  const rows = await db
    .select({ number: revisions.number })
    .from(revisions)
    .where(eq(revisions.retrofitId, retrofitId));
  return rows.map((r) => r.number).sort((a, b) => a - b);
}

const oneTo = (n: number) => Array.from({ length: n }, (_, i) => i + 1);

describe("concurrent generation", () => {
  it("gives unique gapless numbers", async () => {
    const api = jsonClient(await makeToken((await makeUser("engineer")).id));
    const id = await newRetrofit(api);
    const n = 6;
    const answers = await Promise.all(
      Array.from({ length: n }, () => api(`/api/v1/retrofits/${id}/revisions`, { method: "POST" })),
    );
    // 202 at once: each revision is created building with its number; workers build them later.
    expect(answers.map((a) => a.status)).toEqual(Array(n).fill(202));
    const numbers = await Promise.all(
      answers.map(async (a) => ((await a.json()) as { revision: { number: number } }).revision.number),
    );
    expect([...numbers].sort((a, b) => a - b)).toEqual(oneTo(n));
    expect(await storedNumbers(id)).toEqual(oneTo(n));
  });

  // A burst for one retrofit: every request needs the same row lock. The
  // planning (the stage's tolerance spread) and the bundle's source check run
  // before the lock, and requests for one retrofit wait in memory for their
  // turn (lib/revisions/one-at-a-time.ts), so the lock's queue holds no pool
  // connections. With the checks inside the lock the pool (10 connections,
  // 5 s wait: db/client.ts) ran dry: against a dev server on the shared 2-core
  // machine 13 of these 40 answered 500 ("timeout exceeded when trying to
  // connect"), and the check moved alone still lost some at load 12.
  it("answers 202 to a burst of 40 for one retrofit, none refused, numbers gapless", async () => {
    const api = jsonClient(await makeToken((await makeUser("engineer")).id));
    const id = await newRetrofit(api);
    const n = 40;
    const answers = await Promise.all(
      Array.from({ length: n }, () => api(`/api/v1/retrofits/${id}/revisions`, { method: "POST" })),
    );
    const statuses = answers.map((a) => a.status);
    expect(statuses).toEqual(Array(n).fill(202));
    const numbers = await Promise.all(
      answers.map(async (a) => ((await a.json()) as { revision: { number: number } }).revision.number),
    );
    expect([...numbers].sort((a, b) => a - b)).toEqual(oneTo(n));
    expect(await storedNumbers(id)).toEqual(oneTo(n));
  });
});
