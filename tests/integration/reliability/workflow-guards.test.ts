// Issue 15, round two: secrets are not cached, an archived retrofit takes no
// more workflow (checked under its row lock), a field check or use-as-stage
// cannot cite another retrofit's capture, and a cookie mutation with a body
// that is not JSON is a 415.
// Sources: Cache-Control no-store, RFC 9111 section 5.2.2.5; 415 Unsupported
// Media Type, RFC 9110 section 15.5.16; row locks, PostgreSQL manual
// "Explicit Locking" (SELECT ... FOR UPDATE waits for a conflicting lock and
// then reads the committed row); pg_stat_activity.wait_event_type "Lock",
// PostgreSQL manual "The Cumulative Statistics System".
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { retrofits } from "@/db/schema";
import { BASE_URL } from "../../helpers/server";
import { isErrorShape, send } from "./client";
import {
  fingerprint,
  makeCapture,
  makeComment,
  makeRetrofit,
  makeRevision,
  makeWorld,
  squareCsv,
  type World,
} from "./world";

let w: World;
beforeAll(async () => {
  w = await makeWorld();
}, 300_000);

type Json = Record<string, unknown>;
async function bodyOf(res: Response): Promise<Json> {
  const text = await res.text();
  return text ? (JSON.parse(text) as Json) : {};
}
const errorOf = (b: Json) => (b as { error: { code: string; message: string; fields?: Json } }).error;

describe("answers that carry a secret are never cached", () => {
  it("a new API token (cookie and bearer) has Cache-Control: no-store", async () => {
    const byCookie = await w.actors.engineer.session.json<{ token: unknown }>("/api/v1/tokens", {
      method: "POST",
      body: { name: "bench laptop" },
    });
    expect(byCookie.status).toBe(201);
    const res = await w.actors.engineer.session.fetch("/api/v1/tokens", {
      method: "POST",
      body: JSON.stringify({ name: "second laptop" }),
      headers: { "content-type": "application/json" },
    });
    expect(res.status).toBe(201);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const bearer = await send(w, "reviewer", "POST", { path: "/api/v1/tokens", json: { name: "script" } });
    expect(bearer.status).toBe(201);
    expect(bearer.headers.get("cache-control")).toBe("no-store");
  });

  it("a new invitation (its one-time link) has Cache-Control: no-store", async () => {
    const res = await w.actors.admin.session.fetch("/api/v1/invitations", {
      method: "POST",
      body: JSON.stringify({ email: `nostore-${w.tag}@example.test`, name: "Ada Ostberg", role: "reviewer" }),
      headers: { "content-type": "application/json" },
    });
    const body = await bodyOf(res);
    expect(res.status, JSON.stringify(body)).toBe(201);
    expect(String(body.link)).toMatch(/\/invite\//);
    expect(res.headers.get("cache-control")).toBe("no-store");
  });
});

describe("cookie mutations whose body is not JSON are 415", () => {
  const forms = [
    { type: "text/plain", body: JSON.stringify({ body: "forged" }) },
    { type: "application/x-www-form-urlencoded", body: "body=forged" },
    {
      type: "multipart/form-data; boundary=x",
      body: '--x\r\nContent-Disposition: form-data; name="body"\r\n\r\nforged\r\n--x--\r\n',
    },
  ];
  it.each(forms)("$type from our own origin is refused and stores nothing", async (f) => {
    const before = await fingerprint(w);
    const res = await w.actors.reviewer.session.fetch(
      `/api/v1/revisions/${w.revision.awaiting_check}/comments`,
      { method: "POST", body: f.body, headers: { "content-type": f.type, origin: BASE_URL } },
    );
    const body = await bodyOf(res);
    expect(res.status, JSON.stringify(body)).toBe(415);
    expect(isErrorShape(body)).toBe(true);
    expect(errorOf(body).code).toBe("unsupported_media_type");
    expect(errorOf(body).message).toContain("application/json");
    expect(await fingerprint(w)).toBe(before);
  });

  it("a token request is not held to the content type (no ambient credential)", async () => {
    const res = await send(
      w,
      "reviewer",
      "POST",
      { path: `/api/v1/revisions/${w.revision.awaiting_check}/comments` },
      { body: JSON.stringify({ body: "Sent by a script as text/plain." }), type: "text/plain" },
    );
    expect(res.status, res.text).toBe(201);
  });

  it("the capture upload by cookie still takes multipart/form-data and raw CSV", async () => {
    const form = new FormData();
    form.append("file", new Blob([squareCsv()], { type: "text/csv" }), "square.csv");
    const multipart = await w.actors.technician.session.fetch("/api/v1/captures", {
      method: "POST",
      body: form,
    });
    expect(multipart.status, await multipart.clone().text()).toBe(201);
    const raw = await w.actors.technician.session.fetch("/api/v1/captures?name=raw.csv", {
      method: "POST",
      body: squareCsv(),
      headers: { "content-type": "text/csv" },
    });
    expect(raw.status, await raw.clone().text()).toBe(201);
  });
});

describe("another retrofit's capture answers like a missing one", () => {
  it("a field check citing it is a 404 identical to an unknown capture's, and stores nothing", async () => {
    const other = await makeRetrofit(w, w.author.id);
    const foreign = await makeCapture(other.id, w.actors.technician.id);
    const json = (captureId: number) => ({
      revisionId: w.revision.released,
      captureId,
      signedOffBy: "T. Field",
    });
    const before = await fingerprint(w);
    const cited = await send(w, "technician", "POST", { path: "/api/v1/field-checks", json: json(foreign) });
    const missing = await send(w, "technician", "POST", {
      path: "/api/v1/field-checks",
      json: json(2147483000),
    });
    expect(cited.status, cited.text).toBe(404);
    expect(cited.body).toEqual(missing.body);
    expect(await fingerprint(w)).toBe(before);
    // The retrofit's own capture is accepted (the rule is not "refuse every capture").
    const own = await send(w, "technician", "POST", {
      path: "/api/v1/field-checks",
      json: json(w.captureId),
    });
    expect(own.status, own.text).toBe(201);
  });

  it("use-as-stage for another retrofit than the capture's is a 404 like an unknown capture", async () => {
    const other = await makeRetrofit(w, w.author.id);
    const before = await fingerprint(w);
    const cited = await send(w, "engineer", "POST", {
      path: `/api/v1/captures/${w.captureId}/use-as-stage`,
      json: { retrofitId: other.id },
    });
    const missing = await send(w, "engineer", "POST", {
      path: `/api/v1/captures/2147483000/use-as-stage`,
      json: { retrofitId: other.id },
    });
    expect(cited.status, cited.text).toBe(404);
    expect((cited.body as Json).error).toMatchObject({
      code: "not_found",
      message: "Capture was not found.",
    });
    expect((missing.body as Json).error).toMatchObject({
      code: "not_found",
      message: "Capture was not found.",
    });
    expect(await fingerprint(w)).toBe(before);
  });
});

/** A retrofit of this world with a revision in each state, a thread and a capture. */
async function busyRetrofit() {
  const rf = await makeRetrofit(w, w.author.id);
  const released = (await makeRevision(rf.id, w.author.id, "released")).id;
  const awaiting = (await makeRevision(rf.id, w.author.id, "awaiting_check")).id;
  const prepared = (await makeRevision(rf.id, w.author.id, "prepared")).id;
  const thread = await makeComment(awaiting, w.actors.reviewer.id);
  const captureId = await makeCapture(rf.id, w.actors.technician.id);
  return { id: rf.id, released, awaiting, prepared, thread: thread.id, captureId };
}
type Busy = Awaited<ReturnType<typeof busyRetrofit>>;

const ACTIONS: {
  what: string;
  as: "engineer" | "reviewer" | "technician";
  req: (r: Busy) => { path: string; json: Json };
}[] = [
  {
    what: "submit",
    as: "engineer",
    req: (r) => ({ path: `/api/v1/revisions/${r.prepared}/submit`, json: {} }),
  },
  {
    what: "release",
    as: "reviewer",
    req: (r) => ({ path: `/api/v1/revisions/${r.awaiting}/decision`, json: { decision: "release" } }),
  },
  {
    what: "return",
    as: "reviewer",
    req: (r) => ({
      path: `/api/v1/revisions/${r.awaiting}/decision`,
      json: { decision: "return", note: "Prescaler too coarse." },
    }),
  },
  {
    what: "comment",
    as: "reviewer",
    req: (r) => ({ path: `/api/v1/revisions/${r.awaiting}/comments`, json: { body: "One more thing." } }),
  },
  {
    what: "resolve a thread",
    as: "reviewer",
    req: (r) => ({ path: `/api/v1/comments/${r.thread}`, json: { resolved: true } }),
  },
  {
    what: "field check",
    as: "technician",
    req: (r) => ({
      path: "/api/v1/field-checks",
      json: { revisionId: r.released, measuredPeriodS: 10e-3, measuredHighS: 2e-3, signedOffBy: "T. Field" },
    }),
  },
  {
    what: "use-as-stage",
    as: "engineer",
    req: (r) => ({ path: `/api/v1/captures/${r.captureId}/use-as-stage`, json: {} }),
  },
  {
    what: "generation",
    as: "engineer",
    req: (r) => ({ path: `/api/v1/retrofits/${r.id}/revisions`, json: {} }),
  },
];

describe("an archived retrofit takes no more workflow", () => {
  let r: Busy;
  beforeAll(async () => {
    r = await busyRetrofit();
    const res = await send(w, "engineer", "DELETE", { path: `/api/v1/retrofits/${r.id}` });
    expect(res.status, res.text).toBe(200);
  }, 300_000);

  it.each(ACTIONS)("$what is a 409 naming the archived state and changes nothing", async (a) => {
    const method = a.what === "resolve a thread" ? "PATCH" : "POST";
    const before = await fingerprint(w);
    const res = await send(w, a.as, method, a.req(r));
    expect(res.status, res.text).toBe(409);
    expect(isErrorShape(res.body)).toBe(true);
    const err = errorOf(res.body as Json);
    expect(err.message).toMatch(/is archived/);
    expect(err.fields).toEqual({ state: "archived" });
    expect(await fingerprint(w)).toBe(before);
  });
});

/** Sessions of this database waiting on a lock (other than this test's own). */
async function lockWaiters(): Promise<number> {
  const rows = await db.execute<{ n: number }>(
    sql`select count(*)::int as n from pg_stat_activity where datname = current_database() and wait_event_type = 'Lock' and pid <> pg_backend_pid() and query ilike '%"retrofits"%for update%'`,
  );
  return Number(rows.rows[0].n);
}

describe("the archived check holds under a race", () => {
  // The test holds the retrofit row lock, sends the action, waits until the
  // action's transaction waits for that lock, archives the retrofit and lets
  // go. An action that checked without the lock would pass its check before
  // the archive and never wait: the wait below then times out, and the
  // action is accepted, so the test fails either way.
  const RACED = ACTIONS.filter((a) =>
    ["submit", "release", "comment", "field check", "use-as-stage"].includes(a.what),
  );
  it.each(RACED)(
    "$what sent while the retrofit is being archived is refused",
    { timeout: 60_000 },
    async (a) => {
      const r = await busyRetrofit();
      const answer = await db.transaction(async (tx) => {
        await tx.select({ id: retrofits.id }).from(retrofits).where(eq(retrofits.id, r.id)).for("update");
        const base = await lockWaiters();
        const pending = send(w, a.as, a.what === "resolve a thread" ? "PATCH" : "POST", a.req(r));
        const until = Date.now() + 15_000;
        let waited = false;
        while (Date.now() < until) {
          if ((await lockWaiters()) > base) {
            waited = true;
            break;
          }
          await new Promise((ok) => setTimeout(ok, 50));
        }
        await tx.update(retrofits).set({ archivedAt: new Date() }).where(eq(retrofits.id, r.id));
        return { waited, pending };
      });
      const res = await answer.pending;
      expect(answer.waited, `${a.what} did not wait for the retrofit row lock`).toBe(true);
      expect(res.status, res.text).toBe(409);
      expect(errorOf(res.body as Json).fields).toEqual({ state: "archived" });
    },
  );
});
