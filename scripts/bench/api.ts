// API part: POST /api/v1/plan and GET /api/v1/revisions/:id/bundle under
// 50 concurrent connections on loopback, against the production server that
// scripts/bench.sh started (BENCH_BASE_URL). Authenticates with a personal
// API token written straight to the bench database.
import { randomBytes } from "node:crypto";
import { db } from "@/db/client";
import { apiTokens, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { newTokenSecret } from "@/lib/auth/tokens";
import { buildRevision } from "@/lib/revisions/generate";
import { figure, skipped, type Figure } from "./figures";
import { load, type LoadResult } from "./load";
import { deviceClocks, STAGE } from "./workload";

const CONNECTIONS = 50;
const SECONDS = Number(process.env.BENCH_LOAD_SECONDS ?? 10);
const WARMUP_SECONDS = 3;

export async function benchToken(): Promise<string> {
  const [user] = await db
    .insert(users)
    .values({
      email: `bench-${randomBytes(5).toString("hex")}@bench.invalid`,
      name: "Benchmark",
      role: "engineer",
      passwordHash: await hashPassword(randomBytes(24).toString("base64url")),
    })
    .returning();
  const t = newTokenSecret();
  await db.insert(apiTokens).values({ userId: user.id, name: "bench", tokenHash: t.hash, prefix: t.prefix });
  return t.secret;
}

class RouteMissing extends Error {}

const reason = (e: unknown) =>
  e instanceof RouteMissing
    ? `skipped: route missing (${e.message})`
    : `skipped: ${e instanceof Error ? e.message : String(e)}`;

/** Next answers an unknown path with its HTML 404 page, a known path without the method with 405. */
async function call(base: string, token: string, method: string, route: string, body?: unknown) {
  const res = await fetch(base + route, {
    method,
    headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const json = (res.headers.get("content-type") ?? "").includes("json");
  if ((res.status === 404 && !json) || res.status === 405) throw new RouteMissing(`${method} ${route}`);
  const text = await res.text();
  if (!res.ok) throw new Error(`${method} ${route} answered ${res.status}: ${text.slice(0, 200)}`);
  return json ? (JSON.parse(text) as Record<string, unknown>) : {};
}

/** The id of a created object, whether answered bare or wrapped ({ retrofit: {...} }). */
export function idOf(body: Record<string, unknown>, key: string): number {
  const inner = body[key] as Record<string, unknown> | undefined;
  const id = body.id ?? inner?.id;
  if (typeof id !== "number")
    throw new Error(`no ${key} id in the answer: ${JSON.stringify(body).slice(0, 200)}`);
  return id;
}

function loadFigures(what: string, r: LoadResult, p95Target?: number): Figure[] {
  const note = `${CONNECTIONS} connections, ${SECONDS} s, ${r.requests} requests`;
  return [
    figure(`api: ${what} req/s`, r.perSecond, "req/s", { op: ">=", value: 300 }, note),
    figure(`api: ${what} p50`, r.p50Ms, "ms"),
    figure(
      `api: ${what} p95`,
      r.p95Ms,
      "ms",
      p95Target === undefined ? undefined : { op: "<=", value: p95Target },
    ),
    figure(`api: ${what} p99`, r.p99Ms, "ms"),
    figure(`api: ${what} errors`, r.errors, "", { op: "=", value: 0 }, JSON.stringify(r.statuses)),
  ];
}

async function measure(opts: {
  url: string;
  method: string;
  headers: Record<string, string>;
  body?: string;
}) {
  await load({ ...opts, connections: 10, duration: WARMUP_SECONDS });
  return load({ ...opts, connections: CONNECTIONS, duration: SECONDS });
}

export async function apiPart(log: (s: string) => void) {
  const base = process.env.BENCH_BASE_URL;
  if (!base) throw new Error("BENCH_BASE_URL not set (run through scripts/bench.sh)");
  const token = await benchToken();
  const headers = { authorization: `Bearer ${token}`, "content-type": "application/json" };
  const targets = deviceClocks().map((c) => ({ ...c, mode: "pwm" }));
  const figures: Figure[] = [];
  const details: Record<string, unknown> = {};

  // Plan: the stage without tolerances (the Monte Carlo cost is the engine
  // figure) and one atmega328p target, the same body every time.
  try {
    const bare = { ...STAGE, tolerances: undefined }; // dropped by JSON.stringify
    const body = { stage: bare, targets: [targets[0]] };
    const answer = await call(base, token, "POST", "/api/v1/plan", body);
    if (!Array.isArray(answer.plans))
      throw new Error(`no plans in the answer: ${JSON.stringify(answer).slice(0, 200)}`);
    const r = await measure({
      url: `${base}/api/v1/plan`,
      method: "POST",
      headers,
      body: JSON.stringify(body),
    });
    log(`api: plan ${r.perSecond.toFixed(0)} req/s, p95 ${r.p95Ms.toFixed(1)} ms`);
    figures.push(...loadFigures("POST /plan", r));
    // Against a trivial route of the same server with the same bearer-token
    // authentication (GET /api/v1/tokens: the auth lookup plus one small
    // query), measured in the same run: the ratio says what planning costs on
    // top of the framework and authentication, whatever the machine.
    const trivialUrl = `${base}/api/v1/tokens`;
    await call(base, token, "GET", "/api/v1/tokens");
    const trivial = await measure({ url: trivialUrl, method: "GET", headers });
    log(`api: trivial ${trivial.perSecond.toFixed(0)} req/s, p95 ${trivial.p95Ms.toFixed(1)} ms`);
    figures.push(figure("api: GET /tokens (trivial) req/s", trivial.perSecond, "req/s"));
    figures.push(figure("api: GET /tokens (trivial) p95", trivial.p95Ms, "ms"));
    figures.push(
      figure(
        "api: POST /plan throughput / trivial route",
        r.perSecond / trivial.perSecond,
        "",
        { op: ">=", value: 0.8 },
        `same server, same authentication, ${CONNECTIONS} connections each`,
      ),
    );
    // Where the rest goes: one connection shows each route's own service time
    // without queueing; the difference is body parsing, validation and the engine.
    const oneConnection = (url: string, method: string, body?: string) =>
      load({ url, method, headers, ...(body ? { body } : {}), connections: 1, duration: 3 });
    const single = await oneConnection(`${base}/api/v1/plan`, "POST", JSON.stringify(body));
    const singleTrivial = await oneConnection(trivialUrl, "GET");
    figures.push(figure("api: POST /plan p50, 1 connection", single.p50Ms, "ms"));
    figures.push(figure("api: GET /tokens p50, 1 connection", singleTrivial.p50Ms, "ms"));
    figures.push(
      figure(
        "api: POST /plan extra service time",
        single.p50Ms - singleTrivial.p50Ms,
        "ms",
        undefined,
        "body read + zod validation + analyzeStage + planTarget + JSON answer, beyond framework and authentication",
      ),
    );
    details.trivial = { ...trivial, singleConnection: singleTrivial };
    details.plan = { ...r, singleConnection: single };
  } catch (e) {
    figures.push(skipped("api: POST /plan", reason(e)));
  }

  // Bundle: a retrofit and a generated revision made through the API first.
  try {
    const retrofit = await call(base, token, "POST", "/api/v1/retrofits", {
      name: "Bench firing stage",
      site: "Bench",
      assetTag: "BENCH-1",
      mainsPowered: true,
      drivesThyristor: true,
      stage: STAGE,
      targets,
    });
    const retrofitId = idOf(retrofit, "retrofit");
    // 202: the revision is building; built here in the bench process (the queue part measures workers).
    const revision = await call(base, token, "POST", `/api/v1/retrofits/${retrofitId}/revisions`, {});
    const revisionId = idOf(revision, "revision");
    await buildRevision(revisionId);
    const url = `${base}/api/v1/revisions/${revisionId}/bundle`;
    await call(base, token, "GET", `/api/v1/revisions/${revisionId}/bundle`);
    const r = await measure({ url, method: "GET", headers });
    log(`api: bundle ${r.perSecond.toFixed(0)} req/s, p95 ${r.p95Ms.toFixed(1)} ms`);
    figures.push(...loadFigures("GET bundle", r));
    details.bundle = { retrofitId, revisionId, ...r };
  } catch (e) {
    figures.push(skipped("api: GET bundle", reason(e)));
  }
  return { figures, details };
}
