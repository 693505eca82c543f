// Revision generation on the real job queue (pg-boss on PostgreSQL), with real
// worker processes (scripts/worker.ts) on a database of this file's own.
// What is checked is the queue's promise, not a number from a document:
// - pg-boss hands a job to one worker at a time (its fetch takes rows with
//   SELECT ... FOR UPDATE SKIP LOCKED; PostgreSQL manual, "The Locking Clause");
// - a job whose worker vanished is failed at its expiry and retried
//   (pg-boss 10 README, "expireInSeconds" and "retryLimit");
// - a transaction whose connection dies is rolled back, so a killed worker
//   leaves no half-written revision (PostgreSQL manual, "Transactions" tutorial).
import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  auditBurst,
  jobsFinishedBy,
  pollUntil,
  prepareDatabase,
  privateDatabaseUrl,
  startWorker,
  stopWorker,
  type Worker,
} from "./private-queue";

const DB_URL = privateDatabaseUrl("jobs");
// Set before any product module is imported: db/client and lib/jobs/boss read it once.
process.env.DATABASE_URL = DB_URL;

const load = async () => ({
  ...(await import("@/db/client")),
  ...(await import("@/db/schema")),
  ...(await import("drizzle-orm")),
  ...(await import("@/lib/jobs/boss")),
  ...(await import("@/lib/jobs/generate-job")),
  ...(await import("@/lib/jobs/queues")),
});
let m: Awaited<ReturnType<typeof load>>;
let retrofitId: number;
let userId: number;
const workers: Worker[] = [];

async function numbersOf(id: number): Promise<number[]> {
  const rows = await m.db
    .select({ n: m.revisions.number })
    .from(m.revisions)
    .where(m.eq(m.revisions.retrofitId, id));
  return rows.map((r) => r.n);
}

async function jobOf(id: string) {
  const b = await m.boss();
  return b.getJobById(m.QUEUES.generateRevision, id, { includeArchive: true });
}

beforeAll(async () => {
  await prepareDatabase(DB_URL);
  m = await load();
  // The demo retrofit with the fewest targets: the fewest compiler runs per job.
  const [r] = await m.db
    .select({ id: m.targets.retrofitId, n: m.count() })
    .from(m.targets)
    .groupBy(m.targets.retrofitId)
    .orderBy(m.count(), m.targets.retrofitId)
    .limit(1);
  retrofitId = r.id;
  const [u] = await m.db
    .select({ id: m.users.id })
    .from(m.users)
    .where(m.eq(m.users.role, "engineer"))
    .limit(1);
  userId = u.id;
}, 600_000);

afterAll(async () => {
  for (const w of workers) await stopWorker(w, "SIGKILL");
  await m?.stopBoss();
  await (globalThis as unknown as { clockgraftPool?: { end(): Promise<void> } }).clockgraftPool?.end();
});

describe("two worker processes and a burst of generations", () => {
  it("runs every job exactly once and numbers the revisions without gaps", async () => {
    const a = await startWorker("worker A", DB_URL);
    const b = await startWorker("worker B", DB_URL);
    workers.push(a, b);
    const before = await numbersOf(retrofitId);

    const BURST = 6;
    const jobIds = await Promise.all(
      Array.from({ length: BURST }, (_, i) =>
        m.requestGeneration({ retrofitId, userId, note: `burst ${i}` }),
      ),
    );
    const outcomes = await Promise.all(jobIds.map((id) => m.awaitGeneration(id, 540_000)));

    expect(outcomes.every((o) => o.ok)).toBe(true);
    const numbers = await numbersOf(retrofitId);
    expect(numbers).toHaveLength(before.length + BURST);
    expect(auditBurst(jobIds, [jobsFinishedBy(a), jobsFinishedBy(b)], numbers)).toEqual([]);
    // Both workers took part (one job at a time each: batchSize 1 in scripts/worker.ts).
    expect(jobsFinishedBy(a).length).toBeGreaterThan(0);
    expect(jobsFinishedBy(b).length).toBeGreaterThan(0);
    for (const id of jobIds) expect((await jobOf(id))?.retryCount).toBe(0);

    await stopWorker(a);
    await stopWorker(b);
  }, 600_000);

  // Planted faults: the audit above must catch a job run twice, a job never
  // run and a gap or a repeat in the numbers, or the test above proves nothing.
  it("the burst audit catches a double run, a lost job, a gap and a repeat", () => {
    const j = ["00000000-0000-4000-8000-000000000001", "00000000-0000-4000-8000-000000000002"];
    expect(auditBurst(j, [[j[0]], [j[1]]], [1, 2, 3])).toEqual([]);
    expect(auditBurst(j, [[j[0], j[1]], [j[1]]], [1, 2, 3]).join()).toMatch(/ran 2 times/);
    expect(auditBurst(j, [[j[0]], []], [1, 2, 3]).join()).toMatch(/ran 0 times/);
    expect(auditBurst(j, [[j[0]], [j[1]]], [1, 2, 4]).join()).toMatch(/not 1\.\.3/);
    expect(auditBurst(j, [[j[0]], [j[1]]], [1, 2, 2]).join()).toMatch(/not 1\.\.3/);
  });
});

describe("a worker killed with SIGKILL during a generation", () => {
  it("leaves no revision behind, and the job is retried after its expiry on another worker", async () => {
    // Short expiry for this job only: queueOptions reads it when the job is sent.
    const EXPIRE = 40;
    process.env.CLOCKGRAFT_JOB_EXPIRE_SECONDS = String(EXPIRE);
    const victim = await startWorker("victim", DB_URL);
    workers.push(victim);
    const before = await numbersOf(retrofitId);

    const jobId = await m.requestGeneration({ retrofitId, userId, note: "killed mid-job" });
    delete process.env.CLOCKGRAFT_JOB_EXPIRE_SECONDS;
    await pollUntil("the victim to start the job", 120_000, async () =>
      (await jobOf(jobId))?.state === "active" ? true : undefined,
    );
    await stopWorker(victim, "SIGKILL");
    const killedAt = Date.now();

    // Nothing of the job is in the database: no row, no number taken.
    expect(await numbersOf(retrofitId)).toEqual(before);
    expect((await jobOf(jobId))?.state).toBe("active"); // lost, not finished

    const rescuer = await startWorker("rescuer", DB_URL);
    workers.push(rescuer);
    const outcome = await m.awaitGeneration(jobId, 540_000);
    const job = await jobOf(jobId);

    expect(outcome.ok).toBe(true);
    expect(job?.state).toBe("completed");
    expect(job?.retryCount).toBeGreaterThanOrEqual(1);
    // Not before the expiry: pg-boss fails a lost job only once it is expired.
    expect(Date.now() - killedAt).toBeGreaterThanOrEqual((EXPIRE - 10) * 1000);
    expect(jobsFinishedBy(rescuer)).toEqual([jobId]);

    // Exactly one new revision, whole: the stored bundle hashes to its recorded sha256, and it has its files.
    const numbers = await numbersOf(retrofitId);
    expect(numbers.sort((x, y) => x - y)).toEqual([...before, before.length + 1].sort((x, y) => x - y));
    if (!outcome.ok) return;
    const [rev] = await m.db.select().from(m.revisions).where(m.eq(m.revisions.id, outcome.revisionId));
    expect(createHash("sha256").update(rev.bundle).digest("hex")).toBe(rev.bundleSha256);
    const files = await m.db
      .select({ n: m.count() })
      .from(m.revisionFiles)
      .where(m.eq(m.revisionFiles.revisionId, rev.id));
    expect(files[0].n).toBeGreaterThan(0);
    await stopWorker(rescuer);
  }, 600_000);
});
