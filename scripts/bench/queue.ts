// Queue part: revisions built per minute with one and with two worker
// processes (scripts/worker.ts, started here against the bench database), the
// time from "generate" (POST answered 202) to "ready" for a six-device
// revision, and the web server's latency (POST /api/v1/plan, one request at a
// time) while the workers are idle and while they build. Printed figures only:
// the two shared cores of a development machine make these vary a lot.
import { spawn, type ChildProcess } from "node:child_process";
import { benchToken, idOf } from "./api";
import { figure, skipped, type Figure } from "./figures";
import { deviceClocks, STAGE } from "./workload";

const BURST = Number(process.env.BENCH_QUEUE_BURST ?? 4);
const BUILD_TIMEOUT_MS = 900_000;

type Worker = { proc: ChildProcess; ready: Promise<void> };

function startWorker(): Worker {
  const proc = spawn("npx", ["tsx", "scripts/worker.ts"], {
    env: process.env,
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
  });
  const ready = new Promise<void>((resolve, reject) => {
    const seen = (b: Buffer) => b.toString().includes(": ready") && resolve();
    proc.stdout?.on("data", seen);
    proc.once("exit", (code) => reject(new Error(`worker exited with ${code} before it was ready`)));
  });
  return { proc, ready };
}

async function stopWorker(w: Worker): Promise<void> {
  if (w.proc.exitCode !== null) return;
  const exited = new Promise((r) => w.proc.once("exit", r));
  try {
    process.kill(-(w.proc.pid as number), "SIGTERM");
  } catch {
    return;
  }
  await exited;
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

export async function queuePart(log: (s: string) => void) {
  const base = process.env.BENCH_BASE_URL;
  if (!base) throw new Error("BENCH_BASE_URL not set (run through scripts/bench.sh)");
  const token = await benchToken();
  const headers = { authorization: `Bearer ${token}`, "content-type": "application/json" };
  const post = async (path: string, body: unknown) => {
    const res = await fetch(base + path, { method: "POST", headers, body: JSON.stringify(body) });
    const json = (await res.json()) as Record<string, unknown>;
    if (res.status >= 300) throw new Error(`POST ${path} answered ${res.status}: ${JSON.stringify(json)}`);
    return json;
  };
  const buildState = async (id: number) => {
    const res = await fetch(`${base}/api/v1/revisions/${id}/build`, { headers });
    return ((await res.json()) as { buildState: string; buildError: string | null }).buildState;
  };
  const untilBuilt = async (ids: number[]) => {
    const until = Date.now() + BUILD_TIMEOUT_MS;
    for (;;) {
      const states = await Promise.all(ids.map(buildState));
      if (states.every((s) => s !== "building")) return states;
      if (Date.now() > until) throw new Error(`not built after ${BUILD_TIMEOUT_MS / 1000} s`);
      await new Promise((r) => setTimeout(r, 200));
    }
  };
  const retrofit = async (name: string, targets: unknown[]) =>
    idOf(
      await post("/api/v1/retrofits", {
        name,
        site: "Bench",
        assetTag: `BENCH-${name.length}`,
        mainsPowered: true,
        drivesThyristor: true,
        stage: STAGE,
        targets,
      }),
      "retrofit",
    );
  const planBody = JSON.stringify({
    stage: { ...STAGE, tolerances: undefined },
    targets: [{ ...deviceClocks()[0], mode: "pwm" }],
  });
  /** Sequential plan requests until `done` resolves: the latency a user sees. */
  const sampleLatency = async (done: Promise<unknown>) => {
    let over = false;
    void done.finally(() => (over = true));
    const ms: number[] = [];
    while (!over) {
      const t0 = performance.now();
      await fetch(`${base}/api/v1/plan`, { method: "POST", headers, body: planBody }).then((r) => r.text());
      ms.push(performance.now() - t0);
    }
    return ms.sort((a, b) => a - b);
  };

  const figures: Figure[] = [];
  const details: Record<string, unknown> = {};
  const workers: Worker[] = [];
  try {
    const six = await retrofit(
      "Bench six devices",
      deviceClocks().map((c) => ({ ...c, mode: "pwm" })),
    );
    const one = await retrofit("Bench one device", [{ ...deviceClocks()[0], mode: "pwm" }]);

    const idle = await sampleLatency(new Promise((r) => setTimeout(r, 5_000)));
    figures.push(figure("queue: plan p50, workers idle", percentile(idle, 50), "ms"));
    figures.push(figure("queue: plan p95, workers idle", percentile(idle, 95), "ms"));

    workers.push(startWorker());
    await workers[0].ready;

    const t0 = performance.now();
    const sixId = idOf(await post(`/api/v1/retrofits/${six}/revisions`, {}), "revision");
    const [sixState] = await untilBuilt([sixId]);
    const sixS = (performance.now() - t0) / 1000;
    log(`queue: six-device revision ${sixState} after ${sixS.toFixed(1)} s`);
    figures.push(figure("queue: generate to ready, six devices, 1 worker", sixS, "s", undefined, sixState));

    for (const n of [1, 2]) {
      while (workers.length < n) {
        workers.push(startWorker());
        await workers[workers.length - 1].ready;
      }
      const t1 = performance.now();
      const ids = await Promise.all(
        Array.from({ length: BURST }, async () =>
          idOf(await post(`/api/v1/retrofits/${one}/revisions`, {}), "revision"),
        ),
      );
      const built = untilBuilt(ids);
      const busy = await sampleLatency(built);
      const states = await built;
      const minutes = (performance.now() - t1) / 60_000;
      const note = `${BURST} one-target revisions (atmega328p), ${states.filter((s) => s === "ready").length} ready`;
      log(`queue: ${n} worker(s): ${(BURST / minutes).toFixed(1)} revisions/min`);
      figures.push(
        figure(`queue: revisions built per minute, ${n} worker(s)`, BURST / minutes, "/min", undefined, note),
      );
      figures.push(figure(`queue: plan p50, ${n} worker(s) busy`, percentile(busy, 50), "ms"));
      figures.push(
        figure(
          `queue: plan p95, ${n} worker(s) busy`,
          percentile(busy, 95),
          "ms",
          undefined,
          `${busy.length} requests`,
        ),
      );
      details[`workers${n}`] = { ids, states, minutes, latencyMs: busy };
    }
  } catch (e) {
    figures.push(skipped("queue", e instanceof Error ? e.message : String(e)));
  } finally {
    for (const w of workers) await stopWorker(w);
  }
  return { figures, details };
}
