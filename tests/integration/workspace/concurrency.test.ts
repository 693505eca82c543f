// Revision numbers under concurrent generation: the retrofit row is locked, so
// simultaneous requests get unique, gapless numbers 1..n.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { makeToken, makeUser } from "../../helpers/users";
import { jsonClient, newRetrofitBody } from "./fixtures";

describe("concurrent generation", () => {
  it("gives unique gapless numbers", async () => {
    const api = jsonClient(await makeToken((await makeUser("engineer")).id));
    const res = await api("/api/v1/retrofits", { method: "POST", body: newRetrofitBody() });
    const id = ((await res.json()) as { retrofit: { id: number } }).retrofit.id;
    const n = 6;
    const answers = await Promise.all(
      Array.from({ length: n }, () => api(`/api/v1/retrofits/${id}/revisions`, { method: "POST" })),
    );
    // 202 at once: each revision is created building with its number; workers build them later.
    expect(answers.map((a) => a.status)).toEqual(Array(n).fill(202));
    const numbers = await Promise.all(
      answers.map(async (a) => ((await a.json()) as { revision: { number: number } }).revision.number),
    );
    expect([...numbers].sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6]);
    const rows = await db
      .select({ number: revisions.number })
      .from(revisions)
      .where(eq(revisions.retrofitId, id));
    expect(rows.map((r) => r.number).sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6]);
  });
});
