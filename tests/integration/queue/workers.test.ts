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
import { mkdtemp, symlink } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
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
  ...(await import("@/lib/review/submit")),
});
let m: Awaited<ReturnType<typeof load>>;
let retrofitId: number;
let userId: number;
let engineer: { id: number; email: string; name: string; role: "engineer"; site: null; via: "token" };
const workers: Worker[] = [];

async function numbersOf(id: number): Promise<number[]> {
  const rows = await m.db
    .select({ n: m.revisions.number })
    .from(m.revisions)
    .where(m.eq(m.revisions.retrofitId, id));
  return rows.map((r) => r.n).sort((a, b) => a - b);
}

async function progressOf(revisionId: number): Promise<Record<string, { step: string }>> {
  const [row] = await m.db
    .select({ p: m.revisions.buildProgress })
    .from(m.revisions)
    .where(m.eq(m.revisions.id, revisionId));
  return (row?.p ?? {}) as Record<string, { step: string }>;
}

/** What a revision has stored: its build state, bundle size and file and image rows. */
async function storedOf(revisionId: number) {
  const [row] = await m.db
    .select({ buildState: m.revisions.buildState, bundleSize: m.revisions.bundleSize })
    .from(m.revisions)
    .where(m.eq(m.revisions.id, revisionId));
  const [files] = await m.db
    .select({ n: m.count() })
    .from(m.revisionFiles)
    .where(m.eq(m.revisionFiles.revisionId, revisionId));
  const [images] = await m.db
    .select({ n: m.count() })
    .from(m.revisionImages)
    .where(m.eq(m.revisionImages.revisionId, revisionId));
  return { ...row, files: files.n, images: images.n };
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
    .select({ id: m.users.id, email: m.users.email, name: m.users.name })
    .from(m.users)
    .where(m.eq(m.users.role, "engineer"))
    .limit(1);
  userId = u.id;
  engineer = { ...u, role: "engineer", site: null, via: "token" };
}, 600_000);

/** A PATH holding node, npx and sh only (npx runs its command through sh): the worker starts, but no make or compiler can be found. */
async function pathWithoutToolchains(): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), "cg-no-tools-"));
  await symlink(process.execPath, path.join(dir, "node"));
  await symlink("/usr/bin/npx", path.join(dir, "npx"));
  await symlink("/bin/sh", path.join(dir, "sh"));
  return dir;
}

/** The revision the first build-state test leaves building for the next one. */
let waiting = 0;

afterAll(async () => {
  for (const w of workers) await stopWorker(w, "SIGKILL");
  await m?.stopBoss();
  await (globalThis as unknown as { clockgraftPool?: { end(): Promise<void> } }).clockgraftPool?.end();
});

describe("a revision's build state", () => {
  it("is building at once with its number taken, and cannot be submitted until it is built", async () => {
    // No worker runs yet: the revision stays building.
    const before = await numbersOf(retrofitId);
    const { id } = await m.requestGeneration({ retrofitId, userId, note: "not built yet" });
    waiting = id;
    expect(await numbersOf(retrofitId)).toEqual([...before, before.length + 1]);
    expect(await storedOf(id)).toEqual({ buildState: "building", bundleSize: 0, files: 0, images: 0 });
    expect(Object.values(await progressOf(id)).map((p) => p.step)).not.toContain("done");
    await expect(m.submitRevision(engineer, id)).rejects.toMatchObject({
      code: "conflict",
      message: expect.stringMatching(/still being built/),
    });
  });

  it("a worker without toolchains fails the build with the reason, stores nothing, and does not retry", async () => {
    const dir = await pathWithoutToolchains();
    const bare = await startWorker("no-toolchain worker", DB_URL, { PATH: dir });
    workers.push(bare);
    const { id, jobId } = await m.requestGeneration({ retrofitId, userId, note: "no compilers" });
    const outcome = await m.awaitBuild(id, 300_000);
    expect(outcome.buildState).toBe("failed");
    // The revision sent in the test above was waiting too: the bare worker fails it the same way.
    expect((await m.awaitBuild(waiting, 300_000)).buildState).toBe("failed");
    // lib/firmware/build-images.ts names a missing make (ENOENT) this way.
    expect(outcome.buildError).toMatch(/did not build: make is not installed/);
    const failed = Object.values(await progressOf(id)).filter((p) => p.step === "failed");
    expect(failed.length).toBeGreaterThan(0);
    expect(await storedOf(id)).toEqual({ buildState: "failed", bundleSize: 0, files: 0, images: 0 });
    await pollUntil("the job to complete", 60_000, async () =>
      (await jobOf(jobId))?.state === "completed" ? true : undefined,
    );
    expect((await jobOf(jobId))?.retryCount).toBe(0);
    await expect(m.submitRevision(engineer, id)).rejects.toMatchObject({
      code: "conflict",
      message: expect.stringMatching(/did not build/),
    });
    await stopWorker(bare);
  }, 400_000);
});

describe("two worker processes and a burst of generations", () => {
  it("runs every job exactly once and numbers the revisions without gaps", async () => {
    const a = await startWorker("worker A", DB_URL);
    const b = await startWorker("worker B", DB_URL);
    workers.push(a, b);
    const before = await numbersOf(retrofitId);

    const BURST = 6;
    const started = await Promise.all(
      Array.from({ length: BURST }, (_, i) =>
        m.requestGeneration({ retrofitId, userId, note: `burst ${i}` }),
      ),
    );
    const jobIds = started.map((s) => s.jobId);
    const outcomes = await Promise.all(started.map((s) => m.awaitBuild(s.id, 540_000)));

    expect(outcomes.map((o) => o.buildState)).toEqual(Array(BURST).fill("ready"));
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
  it("leaves the revision building with nothing stored, and the job is retried after its expiry on another worker", async () => {
    // Short expiry for this job only: queueOptions reads it when the job is sent.
    const EXPIRE = 40;
    process.env.CLOCKGRAFT_JOB_EXPIRE_SECONDS = String(EXPIRE);
    const victim = await startWorker("victim", DB_URL);
    workers.push(victim);
    const before = await numbersOf(retrofitId);

    const { id: revisionId, jobId } = await m.requestGeneration({
      retrofitId,
      userId,
      note: "killed mid-job",
    });
    delete process.env.CLOCKGRAFT_JOB_EXPIRE_SECONDS;
    // Killed mid-job: the worker has reported a target's compile start (or already its emulation;
    // nothing is stored before the last transaction, so either is mid-job).
    const MID_JOB = ["compiling", "compiled", "emulating"];
    await pollUntil("the victim to start compiling", 120_000, async () =>
      Object.values(await progressOf(revisionId)).some((p) => MID_JOB.includes(p.step)) ? true : undefined,
    ).catch(async (e: Error) => {
      const progress = JSON.stringify(await progressOf(revisionId));
      throw new Error(`${e.message}; progress ${progress}; victim log:\n${victim.log.slice(-30).join("\n")}`);
    });
    await stopWorker(victim, "SIGKILL");
    const killedAt = Date.now();

    // The revision holds its number and is still building; nothing of the build is stored.
    expect(await numbersOf(retrofitId)).toEqual([...before, before.length + 1]);
    expect(await storedOf(revisionId)).toEqual({
      buildState: "building",
      bundleSize: 0,
      files: 0,
      images: 0,
    });
    expect((await jobOf(jobId))?.state).toBe("active"); // lost, not finished

    const rescuer = await startWorker("rescuer", DB_URL);
    workers.push(rescuer);
    const outcome = await m.awaitBuild(revisionId, 540_000);
    // The build commits before the queue marks its job completed: wait for that mark too.
    const job = await pollUntil("the rescued job to be marked completed", 60_000, async () => {
      const j = await jobOf(jobId);
      return j && j.state !== "active" ? j : undefined;
    });

    expect(outcome.buildState).toBe("ready");
    expect(job?.state).toBe("completed");
    expect(job?.retryCount).toBeGreaterThanOrEqual(1);
    // Not before the expiry: pg-boss fails a lost job only once it is expired.
    expect(Date.now() - killedAt).toBeGreaterThanOrEqual((EXPIRE - 10) * 1000);
    expect(jobsFinishedBy(rescuer)).toEqual([jobId]);

    // Exactly one new revision, whole: the stored bundle hashes to its recorded sha256, and it has its files.
    const numbers = await numbersOf(retrofitId);
    expect(numbers.sort((x, y) => x - y)).toEqual([...before, before.length + 1].sort((x, y) => x - y));
    const [rev] = await m.db.select().from(m.revisions).where(m.eq(m.revisions.id, revisionId));
    expect(createHash("sha256").update(rev.bundle).digest("hex")).toBe(rev.bundleSha256);
    const files = await m.db
      .select({ n: m.count() })
      .from(m.revisionFiles)
      .where(m.eq(m.revisionFiles.revisionId, rev.id));
    expect(files[0].n).toBeGreaterThan(0);
    await stopWorker(rescuer);
  }, 600_000);
});
