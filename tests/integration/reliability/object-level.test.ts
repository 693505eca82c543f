// Object-level rules (product.md "People and roles"): a role that may use a
// route still may not reach objects outside its reach through ids in the URL
// or the body. Each refusal leaves the rows exactly as they were.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { apiTokens, retrofits, revisions } from "@/db/schema";
import { appRoutes } from "./app-tree";
import { isErrorShape, send } from "./client";
import { fingerprint, makeCapture, makeRetrofit, makeRevision, makeWorld, type World } from "./world";

let w: World;
/** A retrofit of another site with an approved revision and a capture by its engineer. */
let other: { retrofitId: number; approved: number; captureId: number };

beforeAll(async () => {
  w = await makeWorld();
  const [rf] = await db
    .insert(retrofits)
    .values({ name: `Reliability other ${w.tag}`, site: `Other site ${w.tag}`, assetTag: `RO-${w.tag}` })
    .returning();
  w.retrofitIds.push(rf.id);
  const { stages, targets } = await import("@/db/schema");
  const { STAGE, TARGET } = await import("./world");
  await db.insert(stages).values({ retrofitId: rf.id, kind: STAGE.kind, values: STAGE });
  await db.insert(targets).values({ retrofitId: rf.id, position: 0, ...TARGET });
  other = {
    retrofitId: rf.id,
    approved: (await makeRevision(rf.id, w.author.id, "released")).id,
    captureId: await makeCapture(rf.id, w.author.id),
  };
});

/** Sends as `as`, expects one of `statuses` with the error shape and no row changed. */
async function refused(
  as: Parameters<typeof send>[1],
  method: Parameters<typeof send>[2],
  path: string,
  json: unknown,
  statuses: number[],
) {
  const before = await fingerprint(w);
  const res = await send(w, as, method, { path, json });
  const what = `${method} ${path} as ${as}: ${res.status} ${res.text.slice(0, 200)}`;
  expect(statuses, what).toContain(res.status);
  expect(isErrorShape(res.body), what).toBe(true);
  expect(await fingerprint(w), `${what}: rows changed`).toBe(before);
  return res;
}

describe("technicians reach approved revisions of their own site only", () => {
  const reads = (id: number) => [
    `/api/v1/revisions/${id}`,
    `/api/v1/revisions/${id}/bundle`,
    `/api/v1/revisions/${id}/files`,
    `/api/v1/revisions/${id}/files/README.md`,
  ];

  it("a draft and an in-review revision are not found, by URL or bundle", async () => {
    for (const id of [w.revision.prepared, w.revision.awaiting_check]) {
      for (const path of reads(id)) await refused("technician", "GET", path, undefined, [404]);
    }
    // The same URLs answer for the approved revision, so the 404 is the rule, not a wrong URL.
    for (const path of reads(w.revision.released)) {
      expect((await send(w, "technician", "GET", { path })).status, path).toBe(200);
    }
  });

  it("another site's approved revision, retrofit history and capture are not found", async () => {
    for (const path of reads(other.approved)) await refused("technician", "GET", path, undefined, [404]);
    await refused(
      "technician",
      "GET",
      `/api/v1/retrofits/${other.retrofitId}/field-checks`,
      undefined,
      [404],
    );
    await refused("technician", "GET", `/api/v1/captures/${other.captureId}`, undefined, [404]);
    await refused("technician", "GET", `/api/v1/captures/${other.captureId}/plot`, undefined, [404]);
  });

  it("a diff with a draft on one side is not found", async () => {
    await refused(
      "technician",
      "GET",
      `/api/v1/diff?a=${w.revision.released}&b=${w.revision.prepared}`,
      undefined,
      [404],
    );
    await refused(
      "technician",
      "GET",
      `/api/v1/diff?a=${w.revision.prepared}&b=${w.revision.released}&format=patch`,
      undefined,
      [404],
    );
  });

  it("field-check lists by revision id do not reveal a draft's checks", async () => {
    const res = await send(w, "technician", "GET", {
      path: `/api/v1/field-checks?revisionId=${w.revision.prepared}`,
    });
    expect([200, 404], res.text).toContain(res.status);
    if (res.status === 200) expect((res.body as { checks: unknown[] }).checks).toEqual([]);
  });

  it("the revision page of a draft shows nothing of it to a technician", async () => {
    const res = await w.actors.technician.session.fetch(`/revisions/${w.revision.prepared}`);
    const html = await res.text();
    expect(res.status).toBe(404);
    expect(html).not.toContain("Not allowed");
    expect(html).not.toContain(w.site);
  });
});

// Existence oracle (issue 15 point 7): what a technician may not see answers
// exactly as what does not exist: same status, same body. MISSING is below
// the id bound (MAX_DB_ID) and far above any row a test run creates.
describe("another site's objects answer exactly like missing ones", () => {
  const MISSING = 2_000_000_000;
  const pairs = (o: typeof other | { approved: number; captureId: number; retrofitId: number }) => [
    `/api/v1/revisions/${o.approved}`,
    `/api/v1/revisions/${o.approved}/bundle`,
    `/api/v1/revisions/${o.approved}/files`,
    `/api/v1/revisions/${o.approved}/files/README.md`,
    `/api/v1/revisions/${o.approved}/comments`,
    `/api/v1/diff?a=${w.revision.released}&b=${o.approved}`,
    `/api/v1/diff?a=${o.approved}&b=${w.revision.released}&format=patch`,
    `/api/v1/diff?a=0&b=${o.approved}`,
    `/api/v1/retrofits/${o.retrofitId}/field-checks`,
    `/api/v1/captures/${o.captureId}`,
    `/api/v1/captures/${o.captureId}/plot`,
  ];
  const missing = () => ({ approved: MISSING, captureId: MISSING, retrofitId: MISSING });

  it("API reads", { timeout: 300_000 }, async () => {
    const seen = pairs(other);
    const gone = pairs(missing());
    for (let i = 0; i < seen.length; i++) {
      const a = await send(w, "technician", "GET", { path: seen[i] });
      const b = await send(w, "technician", "GET", { path: gone[i] });
      expect(a.status, `${seen[i]} vs ${gone[i]}`).toBe(b.status);
      expect(a.text, `${seen[i]} vs ${gone[i]}`).toBe(b.text);
      expect(a.status, seen[i]).toBeGreaterThanOrEqual(400);
    }
  });

  it("a field check citing it", async () => {
    const check = { measuredPeriodS: 0.01, measuredHighS: 0.002, signedOffBy: "A. Tester" };
    for (const [seen, gone] of [
      [
        { ...check, revisionId: other.approved },
        { ...check, revisionId: MISSING },
      ],
      [
        { revisionId: w.revision.released, captureId: other.captureId, signedOffBy: "A. Tester" },
        { revisionId: w.revision.released, captureId: MISSING, signedOffBy: "A. Tester" },
      ],
    ]) {
      const a = await refused("technician", "POST", "/api/v1/field-checks", seen, [404]);
      const b = await refused("technician", "POST", "/api/v1/field-checks", gone, [404]);
      expect(a.text).toBe(b.text);
    }
  });

  it("pages", { timeout: 300_000 }, async () => {
    const s = w.actors.technician.session;
    // Nonces differ per response; everything else must be the same page.
    const page = async (path: string) => {
      const res = await s.fetch(path);
      return {
        status: res.status,
        html: (await res.text()).replace(/nonce="[^"]*"|nonce-[A-Za-z0-9+/=]+/g, ""),
      };
    };
    for (const [seen, gone] of [
      [`/revisions/${other.approved}`, `/revisions/${MISSING}`],
      [`/field/revisions/${other.approved}`, `/field/revisions/${MISSING}`],
      [`/captures/${other.captureId}`, `/captures/${MISSING}`],
      [`/field/retrofits/${other.retrofitId}`, `/field/retrofits/${MISSING}`],
    ]) {
      const a = await page(seen);
      const b = await page(gone);
      expect(a.status, `${seen} vs ${gone}`).toBe(b.status);
      expect(a.status, seen).toBe(404);
      expect(a.html).not.toContain(`Other site ${w.tag}`);
      expect(a.html.includes("Not allowed"), seen).toBe(b.html.includes("Not allowed"));
    }
  });
});

describe("ids in bodies", () => {
  it("a field check against a draft, another site's revision or another site's capture is refused", async () => {
    const check = { measuredPeriodS: 0.01, measuredHighS: 0.002, signedOffBy: "A. Tester" };
    await refused(
      "technician",
      "POST",
      "/api/v1/field-checks",
      { ...check, revisionId: w.revision.prepared },
      [404],
    );
    await refused(
      "technician",
      "POST",
      "/api/v1/field-checks",
      { ...check, revisionId: other.approved },
      [404],
    );
    await refused(
      "technician",
      "POST",
      "/api/v1/field-checks",
      { revisionId: w.revision.released, captureId: other.captureId, signedOffBy: "A. Tester" },
      [404],
    );
  });

  it("a capture upload for another site's retrofit is refused before anything is stored", async () => {
    const before = await fingerprint(w);
    const { squareCsv } = await import("./world");
    const res = await send(w, "technician", "POST", {
      path: `/api/v1/captures?retrofitId=${other.retrofitId}`,
      raw: { body: squareCsv(), type: "text/csv" },
    });
    expect(res.status, res.text).toBe(404);
    expect(isErrorShape(res.body)).toBe(true);
    expect(await fingerprint(w)).toBe(before);
  });

  it("a capture cannot become the stage of a retrofit it does not belong to (404 like a missing capture)", async () => {
    const rf = await makeRetrofit(w, w.author.id);
    await refused(
      "engineer",
      "POST",
      `/api/v1/captures/${other.captureId}/use-as-stage`,
      { retrofitId: rf.id },
      [404],
    );
  });

  it("nobody revokes another user's token", async () => {
    const [t] = await db.select().from(apiTokens).where(eq(apiTokens.userId, w.author.id));
    for (const as of ["admin", "engineer", "technician"] as const) {
      await refused(as, "DELETE", `/api/v1/tokens/${t.id}`, undefined, [404]);
    }
    const [after] = await db.select().from(apiTokens).where(eq(apiTokens.id, t.id));
    expect(after.revokedAt).toBeNull();
  });

  it("ids smuggled into a retrofit edit change only the retrofit in the URL", async () => {
    const a = await makeRetrofit(w, w.author.id);
    const b = await makeRetrofit(w, w.author.id);
    const res = await send(w, "engineer", "PATCH", {
      path: `/api/v1/retrofits/${a.id}`,
      json: { id: b.id, retrofitId: b.id, createdBy: w.actors.admin.id, description: "smuggled" },
    });
    expect([200, 400], res.text).toContain(res.status);
    const [rowB] = await db.select().from(retrofits).where(eq(retrofits.id, b.id));
    expect(rowB.description).toBe("");
    const [rowA] = await db.select().from(retrofits).where(eq(retrofits.id, a.id));
    expect(rowA.createdBy).toBe(w.author.id);
  });

  it("a token made with someone else's user id in the body belongs to the caller", async () => {
    const res = await send(w, "technician", "POST", {
      path: "/api/v1/tokens",
      json: { name: "smuggled", userId: w.actors.admin.id },
    });
    expect([201, 400], res.text).toContain(res.status);
    const adminTokens = await db.select().from(apiTokens).where(eq(apiTokens.userId, w.actors.admin.id));
    expect(adminTokens.map((t) => t.name)).not.toContain("smuggled");
  });

  it("a decision body naming another revision is refused", async () => {
    const rf = await makeRetrofit(w, w.author.id);
    const r = await makeRevision(rf.id, w.author.id, "awaiting_check");
    await refused(
      "reviewer",
      "POST",
      `/api/v1/revisions/${r.id}/decision`,
      { decision: "release", revisionId: w.revision.awaiting_check },
      [400],
    );
  });
});

describe("revisions are immutable", () => {
  it("no route under /api/v1/revisions exports PATCH or PUT", () => {
    const writable = appRoutes().filter(
      (r) => r.pattern.startsWith("/api/v1/revisions") && (r.method === "PATCH" || r.method === "PUT"),
    );
    expect(writable).toEqual([]);
  });

  it("an engineer's PATCH, PUT or DELETE of a revision is refused and the revision is unchanged", async () => {
    const rf = await makeRetrofit(w, w.actors.engineer.id);
    const r = await makeRevision(rf.id, w.actors.engineer.id, "prepared");
    const [before] = await db.select().from(revisions).where(eq(revisions.id, r.id));
    for (const method of ["PATCH", "PUT", "DELETE"] as const) {
      const res = await send(w, "engineer", method, {
        path: `/api/v1/revisions/${r.id}`,
        json: { note: "edited", state: "released", spec: {} },
      });
      expect(res.status, `${method}: ${res.text.slice(0, 200)}`).toBeGreaterThanOrEqual(400);
      expect(res.status, method).toBeLessThan(500);
    }
    const [after] = await db.select().from(revisions).where(eq(revisions.id, r.id));
    expect(after).toEqual(before);
  });
});

describe("nobody decides on a revision they generated", () => {
  it("a reviewer who generated a revision (as an engineer before a role change) cannot approve it", async () => {
    const rf = await makeRetrofit(w, w.author.id);
    const r = await makeRevision(rf.id, w.actors.reviewer.id, "awaiting_check");
    await refused("reviewer", "POST", `/api/v1/revisions/${r.id}/decision`, { decision: "release" }, [403]);
    const [row] = await db.select().from(revisions).where(eq(revisions.id, r.id));
    expect(row.state).toBe("awaiting_check");
  });
});
