// Fault test: PostgreSQL restarts (scripts/pg.sh restart) in the middle of a
// bounded load of revision generation and plan requests. Requests during the
// outage fail cleanly (503 with the error shape, never a 500), the app serves
// again without being restarted, and every revision acknowledged with 202 is
// built afterwards (the restart lands while its worker builds it: the job
// completes or is retried) and stored with a bundle whose sha256 matches. Runs alone, after the
// other tests (scripts/test.sh), because it takes the shared database down.
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { promisify } from "node:util";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { revisionFiles, revisions } from "@/db/schema";
import { BASE_URL } from "../helpers/server";
import { isErrorShape } from "../integration/reliability/client";
import { makeRetrofit, makeWorld } from "../integration/reliability/world";

const run = promisify(execFile);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** DB reads from this process retry while its own pool reconnects. */
async function retrying<T>(fn: () => Promise<T>): Promise<T> {
  for (let i = 0; ; i++) {
    try {
      return await fn();
    } catch (e) {
      if (i >= 40) throw e;
      await sleep(500);
    }
  }
}

type Outcome = { status: number; body: unknown; at: number };

const idOf = (body: unknown) => (body as { revision: { id: number } }).revision.id;

/** Polls a revision until its build has ended; the worker may need a retry after the outage. */
async function untilBuilt(id: number) {
  const until = Date.now() + 420_000;
  for (;;) {
    const [row] = await retrying(() => db.select().from(revisions).where(eq(revisions.id, id)));
    if (!row || row.buildState !== "building" || Date.now() > until) return row;
    await sleep(500);
  }
}

describe("PostgreSQL restart under load", () => {
  it(
    "fails cleanly, recovers without an app restart, loses no acknowledged revision",
    { timeout: 600_000 },
    async () => {
      const w = await makeWorld();
      const rfs = await Promise.all(Array.from({ length: 6 }, () => makeRetrofit(w, w.author.id)));
      const auth = { authorization: `Bearer ${w.actors.engineer.token}`, "content-type": "application/json" };
      const plan = JSON.stringify({
        stage: { kind: "measured", periodS: "10m", highS: "2m" },
        targets: [{ device: "atmega328p", clockSource: "crystal", clockHz: "16M", mode: "pwm" }],
      });

      const outcomes: Outcome[] = [];
      // Generation answers at once (202) and queues a build: a few are enough to keep the worker busy.
      const MAX_GENERATIONS = 8;
      let generations = 0;
      const failures: string[] = [];
      const t0 = Date.now();
      let restartedAt = 0;
      let i = 0;
      // Bounded: 8 workers, at most 600 requests or 25 s.
      const worker = async () => {
        while (outcomes.length + failures.length < 600 && Date.now() - t0 < 25_000) {
          const n = i++;
          const gen = n % 2 === 0 && generations < MAX_GENERATIONS;
          if (gen) generations++;
          const path = gen ? `/api/v1/retrofits/${rfs[n % rfs.length].id}/revisions` : "/api/v1/plan";
          try {
            const res = await fetch(BASE_URL + path, {
              method: "POST",
              headers: auth,
              body: gen ? "{}" : plan,
            });
            const text = await res.text();
            outcomes.push({ status: res.status, body: text ? JSON.parse(text) : null, at: Date.now() });
          } catch (e) {
            failures.push(
              `${path}: ${(e as Error).message} ${(e as { cause?: Error }).cause?.message ?? ""}`,
            );
          }
          if (restartedAt && Date.now() - restartedAt > 8_000) break;
        }
      };
      let buildingAtRestart = 0;
      const restart = (async () => {
        await sleep(2_000);
        // Restart while a worker builds: wait (bounded) for an acknowledged revision still building.
        for (let k = 0; k < 40 && buildingAtRestart === 0; k++) {
          const ids = outcomes.filter((o) => o.status === 202).map((o) => idOf(o.body));
          for (const id of ids) {
            const [row] = await db
              .select({ s: revisions.buildState })
              .from(revisions)
              .where(eq(revisions.id, id));
            if (row?.s === "building") buildingAtRestart++;
          }
          if (buildingAtRestart === 0) await sleep(250);
        }
        await run("bash", ["scripts/pg.sh", "restart"]);
        restartedAt = Date.now();
      })();
      await Promise.all([restart, ...Array.from({ length: 8 }, worker)]);

      // The app process was never restarted; it must answer again on its own.
      let healthy = false;
      for (let k = 0; k < 60 && !healthy; k++) {
        healthy = (await fetch(`${BASE_URL}/api/health`).catch(() => null))?.status === 200;
        if (!healthy) await sleep(500);
      }
      expect(healthy, "health after restart").toBe(true);

      expect(failures, "the app itself stayed reachable").toEqual([]);
      const statuses = outcomes.map((o) => o.status);
      expect(
        statuses.filter((s) => s >= 500 && s !== 503),
        "no 500s",
      ).toEqual([]);
      for (const o of outcomes.filter((x) => x.status >= 400)) {
        expect(isErrorShape(o.body), JSON.stringify(o.body)).toBe(true);
      }
      // The outage must actually have been seen by clients: without at least
      // one 503 the test would pass even if the restart missed the load window.
      expect(
        statuses.filter((s) => s === 503).length,
        "at least one 503 during the PostgreSQL restart",
      ).toBeGreaterThan(0);
      // Work was done before and after the outage.
      expect(outcomes.some((o) => o.status === 202 && o.at < restartedAt)).toBe(true);
      expect(buildingAtRestart, "a revision was building when PostgreSQL restarted").toBeGreaterThan(0);
      const after = await fetch(`${BASE_URL}/api/v1/retrofits/${rfs[0].id}/revisions`, {
        method: "POST",
        headers: auth,
        body: "{}",
      });
      expect(after.status, await after.clone().text()).toBe(202);

      const acked = outcomes.filter((o) => o.status === 202).map((o) => idOf(o.body));
      acked.push(idOf(await after.json()));
      for (const id of acked) {
        // Built by the worker after the restart (or before it); polled, never a fixed sleep.
        const row = await untilBuilt(id);
        expect(row, `revision ${id} acknowledged but missing`).toBeDefined();
        expect(row.buildState, `revision ${id}: ${row.buildError}`).toBe("ready");
        expect(createHash("sha256").update(row.bundle).digest("hex")).toBe(row.bundleSha256);
        const files = await retrying(() =>
          db.select({ id: revisionFiles.id }).from(revisionFiles).where(eq(revisionFiles.revisionId, id)),
        );
        expect(files.length).toBeGreaterThan(0);
      }
      // Numbers per retrofit stay unique and gapless through the outage.
      for (const rf of rfs) {
        const rows = await retrying(() =>
          db.select({ n: revisions.number }).from(revisions).where(eq(revisions.retrofitId, rf.id)),
        );
        const ns = rows.map((x) => x.n).sort((a, b) => a - b);
        expect(ns).toEqual(ns.map((_, k) => k + 1));
      }
    },
  );
});
