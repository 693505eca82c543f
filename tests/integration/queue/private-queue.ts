// A database and worker processes of the queue tests' own. The standing test
// worker (scripts/test.sh, serve-dev.sh) serves the shared test database, so a
// test that counts which worker ran a job, or kills the one running it, needs a
// queue that no other worker reads.
import { execFile, spawn, type ChildProcess } from "node:child_process";
import { promisify } from "node:util";

const run = promisify(execFile);

export function privateDatabaseUrl(tag: string): string {
  const base = process.env.DATABASE_URL;
  if (!base) throw new Error("DATABASE_URL must point at the test database");
  const u = new URL(base);
  u.pathname = `/${u.pathname.slice(1)}_${tag}`;
  return u.toString();
}

/** Fresh database: created, migrated and seeded with the demo data (db/seed). */
export async function prepareDatabase(url: string): Promise<void> {
  const env = { ...process.env, DATABASE_URL: url };
  for (const args of [["scripts/ensure-db.ts", "--fresh"], ["scripts/migrate.ts"], ["scripts/seed.ts"]]) {
    await run("npx", ["tsx", ...args], { env, maxBuffer: 16 << 20 });
  }
}

export type Worker = { proc: ChildProcess; log: string[]; name: string };

/** Starts `scripts/worker.ts` in a process group of its own and waits for "ready". */
export async function startWorker(
  name: string,
  url: string,
  extraEnv: Record<string, string> = {},
): Promise<Worker> {
  const proc = spawn("npx", ["tsx", "scripts/worker.ts"], {
    env: { ...process.env, DATABASE_URL: url, CLOCKGRAFT_JOB_MAINTENANCE_SECONDS: "1", ...extraEnv },
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
  });
  const w: Worker = { proc, log: [], name };
  const take = (b: Buffer) => w.log.push(...b.toString().split("\n").filter(Boolean));
  proc.stdout?.on("data", take);
  proc.stderr?.on("data", take);
  await pollUntil(
    `${name} says ready`,
    120_000,
    () => w.log.some((l) => l.includes(": ready")) || undefined,
    () => {
      if (proc.exitCode !== null) throw new Error(`${name} exited: ${w.log.join("\n")}`);
    },
  );
  return w;
}

/** Kills the whole group (npx, tsx, node) with the given signal and waits for the exit. */
export async function stopWorker(w: Worker, signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
  if (w.proc.exitCode !== null || w.proc.signalCode !== null) return;
  const exited = new Promise((r) => w.proc.once("exit", r));
  try {
    process.kill(-(w.proc.pid as number), signal);
  } catch {
    return; // already gone
  }
  await exited;
}

/** Job ids a worker's log says it finished ("generation job ID ..."). */
export function jobsFinishedBy(w: Worker): string[] {
  return w.log.flatMap((l) => /generation job ([0-9a-f-]{36}) /.exec(l)?.[1] ?? []);
}

/** Polls every 100 ms until probe returns a value; fails after timeoutMs with what it waited for. */
export async function pollUntil<T>(
  what: string,
  timeoutMs: number,
  probe: () => T | undefined | Promise<T | undefined>,
  check?: () => void,
): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    check?.();
    const v = await probe();
    if (v !== undefined) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/**
 * What a burst must show: every job ran on exactly one worker, and the
 * revision numbers of the retrofit are 1..n with no gap and no repeat.
 * Returns the faults found (empty when all is well).
 */
export function auditBurst(jobIds: string[], finishedPerWorker: string[][], numbers: number[]): string[] {
  const faults: string[] = [];
  const runs = new Map<string, number>();
  for (const list of finishedPerWorker) for (const id of list) runs.set(id, (runs.get(id) ?? 0) + 1);
  for (const id of jobIds) {
    const n = runs.get(id) ?? 0;
    if (n !== 1) faults.push(`job ${id} ran ${n} times`);
  }
  for (const id of runs.keys()) if (!jobIds.includes(id)) faults.push(`job ${id} was not sent by this burst`);
  const sorted = [...numbers].sort((a, b) => a - b);
  sorted.forEach((n, i) => {
    if (n !== i + 1) faults.push(`revision numbers are not 1..${sorted.length}: ${sorted.join(",")}`);
  });
  return [...new Set(faults)];
}
