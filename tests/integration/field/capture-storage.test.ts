// Stored captures (issue 15 point 3): a zoomed plot is drawn from the levels
// stored at upload, never from the file again; quotas per user and per
// retrofit; delete for the uploader or an admin while no field check cites it.
// The expected envelope is computed here, independently of the server: each
// point must be the plain min and max of the samples from its tS up to the
// next point's tS (the display-envelope rule in lib/capture/decimate.ts: a
// one-sample spike must survive; common practice for scope displays, no source).
import { and, count, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { auditEvents, captureLevels, captures, fieldChecks, revisions } from "@/db/schema";
import { CAPTURE_QUOTA } from "@/lib/field/capture-quotas";
import { Session, signedIn } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { makeRetrofit, makeRevision, squareCsv } from "./fixtures";

type Point = { tS: number; minV: number; maxV: number };
type Plot = {
  points: Point[];
  window: { fromS: number; toS: number; samplesPerEntry: number; untilS: number | null } | null;
};
type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

/** Demo data: a 1 kHz pulse train at 1 us per sample, 120 000 samples, with
 *  small deterministic noise, a one-sample spike every 997 samples while high
 *  and a one-sample dip every 1009 while low (so the spikes never cross the
 *  50 % reference level). Returns the text and the samples as a reader parses
 *  them (Number() of the same text; lib/capture/fast-number.ts gives the same
 *  double for at most 15 significant digits). */
function noisyTrain(samples = 120_000) {
  let seed = 12345;
  const rand = () => {
    seed = (seed * 1103515245 + 12345) % 2147483648; // ANSI C LCG constants, from memory
    return seed / 2147483648;
  };
  const rows = ["Time (s),CH1 (V)"];
  const t = new Float64Array(samples);
  const v = new Float64Array(samples);
  for (let i = 0; i < samples; i++) {
    const high = (i + 900) % 1000 < 250;
    let x = (high ? 5 : 0) + (rand() - 0.5) * 0.08;
    if (high && i % 997 === 0) x = 6.5 + rand();
    if (!high && i % 1009 === 0) x = -1.5 - rand();
    const ts = (i * 1e-6).toPrecision(10);
    const vs = x.toFixed(4);
    rows.push(`${ts},${vs}`);
    t[i] = Number(ts);
    v[i] = Number(vs);
  }
  return { csv: rows.join("\n") + "\n", t, v };
}

/** First index whose time is >= x. */
function lowerBound(t: Float64Array, x: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (t[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Checks every point against a direct scan of the samples it spans. */
function expectEnvelope(plot: Plot, t: Float64Array, v: Float64Array, fromS: number, toS: number) {
  const p = plot.points;
  expect(p.length).toBeGreaterThan(0);
  expect(p.length).toBeLessThanOrEqual(2000);
  // The window is covered, one sample beyond each end.
  expect(p[0].tS).toBeLessThanOrEqual(fromS);
  const until = plot.window!.untilS;
  if (until !== null) expect(until).toBeGreaterThan(toS);
  for (let k = 0; k < p.length; k++) {
    const a = lowerBound(t, p[k].tS);
    expect(t[a], `point ${k} starts on a sample`).toBe(p[k].tS);
    const endS = k + 1 < p.length ? p[k + 1].tS : until;
    const b = endS === null ? t.length : lowerBound(t, endS);
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = a; i < b; i++) {
      if (v[i] < lo) lo = v[i];
      if (v[i] > hi) hi = v[i];
    }
    // + 0 turns -0 into 0: JSON has no negative zero (ECMA-262, JSON.stringify writes -0 as "0").
    expect([p[k].minV, p[k].maxV], `point ${k} at ${p[k].tS} s (samples ${a}..${b - 1})`).toEqual([
      lo + 0,
      hi + 0,
    ]);
  }
}

let engineer: Awaited<ReturnType<typeof makeUser>>;
let eng: Session;
beforeAll(async () => {
  engineer = await makeUser("engineer");
  eng = await signedIn(engineer.email, TEST_PASSWORD);
});

async function uploadCsv(s: Session, csv: string, query = "") {
  const res = await s.fetch(`/api/v1/captures${query}`, {
    method: "POST",
    body: csv,
    headers: { "content-type": "text/csv" },
  });
  return { status: res.status, body: (await res.json()) as { capture: { id: number } } & ErrorBody };
}

describe("zoomed plot windows come from the stored levels", () => {
  const train = noisyTrain();
  let id: number;
  beforeAll(async () => {
    const up = await uploadCsv(eng, train.csv, "?name=noisy-train.csv");
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    id = up.body.capture.id;
    // The stored file is overwritten with text no parser accepts: a window
    // that parsed the file again would now fail, so every answer below comes
    // from the levels.
    await db
      .update(captures)
      .set({ content: Buffer.from("not a capture\n") })
      .where(eq(captures.id, id));
  });

  it.each([
    { what: "nearly the whole record (a coarse level)", fromS: 0.0005, toS: 0.1195, folded: true },
    { what: "30 ms (the first level above the samples)", fromS: 0.0301, toS: 0.0601, folded: true },
    { what: "1 ms (the samples themselves)", fromS: 0.0403, toS: 0.0413, folded: false },
    { what: "a window of a few samples", fromS: 0.0500005, toS: 0.0500035, folded: false },
    { what: "a window past the end", fromS: 0.1199, toS: 0.5, folded: false },
  ])("$what: each point is the min and max of its samples", async (c) => {
    const res = await eng.fetch(`/api/v1/captures/${id}/plot?fromS=${c.fromS}&toS=${c.toS}`);
    const plot = (await res.json()) as Plot;
    expect(res.status, JSON.stringify(plot).slice(0, 300)).toBe(200);
    expect(plot.window!.samplesPerEntry > 1).toBe(c.folded);
    expectEnvelope(plot, train.t, train.v, c.fromS, c.toS);
  });

  it("keeps one-sample spikes in a coarse window (the envelope, not every Nth sample)", async () => {
    const res = await eng.fetch(`/api/v1/captures/${id}/plot?fromS=0&toS=0.12`);
    const plot = (await res.json()) as Plot;
    const max = Math.max(...plot.points.map((p) => p.maxV));
    const min = Math.min(...plot.points.map((p) => p.minV));
    expect(max).toBe(Math.max(...train.v));
    expect(min).toBe(Math.min(...train.v));
  });

  it("a capture stored without levels gets them on its first zoom, then reads them", async () => {
    const csv = squareCsv({ periodS: 1e-3, highS: 0.25e-3, dtS: 1e-6, periods: 30 });
    const up = await uploadCsv(eng, csv, "?name=older.csv");
    expect(up.status).toBe(201);
    const older = up.body.capture.id;
    await db.delete(captureLevels).where(eq(captureLevels.captureId, older));
    const res = await eng.fetch(`/api/v1/captures/${older}/plot?fromS=0.001&toS=0.02`);
    expect(res.status).toBe(200);
    const [{ n }] = await db
      .select({ n: count() })
      .from(captureLevels)
      .where(eq(captureLevels.captureId, older));
    expect(n).toBeGreaterThan(0);
  });
});

/** Rows stored straight into the table to bring a quota to its edge (tiny content, no levels). */
async function fillCaptures(
  n: number,
  values: { uploadedBy: number; retrofitId: number | null; byteSize?: number },
) {
  const [model] = await db.select({ measurement: captures.measurement }).from(captures).limit(1);
  const rows = Array.from({ length: n }, (_, i) => ({
    retrofitId: values.retrofitId,
    uploadedBy: values.uploadedBy,
    fileName: `filler-${i}.csv`,
    byteSize: values.byteSize ?? 10,
    sha256: "0".repeat(64),
    content: Buffer.from("x"),
    measurement: model.measurement,
  }));
  for (let i = 0; i < rows.length; i += 100) await db.insert(captures).values(rows.slice(i, i + 100));
}

const smallCsv = () => squareCsv({ periodS: 1e-3, highS: 0.25e-3, dtS: 1e-5, periods: 10 });
const storedBy = async (userId: number) =>
  (await db.select({ n: count() }).from(captures).where(eq(captures.uploadedBy, userId)))[0].n;

describe("capture quotas (lib/field/capture-quotas.ts)", () => {
  it("a user at the count limit gets a 409 naming it, and nothing is stored", async () => {
    const u = await makeUser("technician");
    const s = await signedIn(u.email, TEST_PASSWORD);
    await fillCaptures(CAPTURE_QUOTA.perUser.count - 1, { uploadedBy: u.id, retrofitId: null });
    const last = await uploadCsv(s, smallCsv());
    expect(last.status, JSON.stringify(last.body)).toBe(201);
    const over = await uploadCsv(s, smallCsv());
    expect(over.status).toBe(409);
    expect(over.body.error.message).toContain(`the limit of ${CAPTURE_QUOTA.perUser.count}`);
    expect(await storedBy(u.id)).toBe(CAPTURE_QUOTA.perUser.count);
  });

  it("a user past the byte limit gets a 413 naming it, and nothing is stored", async () => {
    const u = await makeUser("technician");
    const s = await signedIn(u.email, TEST_PASSWORD);
    const csv = smallCsv();
    await fillCaptures(1, {
      uploadedBy: u.id,
      retrofitId: null,
      byteSize: CAPTURE_QUOTA.perUser.bytes - 100,
    });
    const over = await uploadCsv(s, csv);
    expect(over.status).toBe(413);
    expect(over.body.error.message).toContain(`${(CAPTURE_QUOTA.perUser.bytes / 2 ** 20).toFixed(1)} MiB`);
    expect(await storedBy(u.id)).toBe(1);
  });

  it("a retrofit at its count limit refuses one more from anyone (409 naming it)", async () => {
    const rf = await makeRetrofit({ createdBy: engineer.id });
    const other = await makeUser("technician");
    await fillCaptures(CAPTURE_QUOTA.perRetrofit.count, { uploadedBy: other.id, retrofitId: rf.id });
    const over = await uploadCsv(eng, smallCsv(), `?retrofitId=${rf.id}`);
    expect(over.status).toBe(409);
    expect(over.body.error.message).toMatch(
      new RegExp(`This retrofit already has ${CAPTURE_QUOTA.perRetrofit.count} captures`),
    );
    const [{ n }] = await db.select({ n: count() }).from(captures).where(eq(captures.retrofitId, rf.id));
    expect(n).toBe(CAPTURE_QUOTA.perRetrofit.count);
  });

  it("parallel uploads at the edge pass the count limit no further (advisory lock)", async () => {
    const u = await makeUser("technician");
    const s = await signedIn(u.email, TEST_PASSWORD);
    await fillCaptures(CAPTURE_QUOTA.perUser.count - 2, { uploadedBy: u.id, retrofitId: null });
    const answers = await Promise.all(Array.from({ length: 5 }, () => uploadCsv(s, smallCsv())));
    expect(answers.filter((a) => a.status === 201)).toHaveLength(2);
    expect(answers.filter((a) => a.status === 409)).toHaveLength(3);
    expect(await storedBy(u.id)).toBe(CAPTURE_QUOTA.perUser.count);
  });
});

describe("deleting a capture", () => {
  it("the uploader or an admin may; other roles that can read it get 403; it goes with its levels and is audited", async () => {
    const tech = await makeUser("technician");
    const techS = await signedIn(tech.email, TEST_PASSWORD);
    const reviewer = await makeUser("reviewer");
    const revS = await signedIn(reviewer.email, TEST_PASSWORD);
    const admin = await makeUser("admin");
    const adminS = await signedIn(admin.email, TEST_PASSWORD);
    const stranger = await makeUser("technician", { site: "Some other site" });
    const strangerS = await signedIn(stranger.email, TEST_PASSWORD);

    const a = (await uploadCsv(techS, smallCsv())).body.capture.id;
    const b = (await uploadCsv(techS, smallCsv())).body.capture.id;
    for (const [s, status] of [
      [revS, 403],
      [eng, 403],
      [strangerS, 404],
    ] as const) {
      const res = await s.fetch(`/api/v1/captures/${a}`, { method: "DELETE" });
      const body = (await res.json()) as ErrorBody;
      expect(res.status, JSON.stringify(body)).toBe(status);
      expect(body.error.message.length).toBeGreaterThan(0);
    }
    const missing = await strangerS.fetch(`/api/v1/captures/2147483000`, { method: "DELETE" });
    expect(await missing.json()).toEqual(
      await (await strangerS.fetch(`/api/v1/captures/${a}`, { method: "DELETE" })).json(),
    );
    expect((await db.select({ n: count() }).from(captures).where(eq(captures.id, a)))[0].n).toBe(1);

    const own = await techS.fetch(`/api/v1/captures/${a}`, { method: "DELETE" });
    expect(own.status).toBe(200);
    const byAdmin = await adminS.fetch(`/api/v1/captures/${b}`, { method: "DELETE" });
    expect(byAdmin.status).toBe(200);
    for (const id of [a, b]) {
      expect((await db.select({ n: count() }).from(captures).where(eq(captures.id, id)))[0].n).toBe(0);
      expect(
        (await db.select({ n: count() }).from(captureLevels).where(eq(captureLevels.captureId, id)))[0].n,
      ).toBe(0);
    }
    const audit = await db
      .select({ actorId: auditEvents.actorId, subjectId: auditEvents.subjectId })
      .from(auditEvents)
      .where(and(eq(auditEvents.action, "capture.delete"), sql`${auditEvents.subjectId} in (${a}, ${b})`));
    expect(audit).toEqual(
      expect.arrayContaining([
        { actorId: tech.id, subjectId: a },
        { actorId: admin.id, subjectId: b },
      ]),
    );
    expect((await techS.fetch(`/api/v1/captures/${a}`)).status).toBe(404);
  });

  it("a capture cited by a field check is kept: 409 naming the check", async () => {
    const rf = await makeRetrofit({ createdBy: engineer.id });
    const rev = await makeRevision({ retrofitId: rf.id, userId: engineer.id, state: "released" });
    const up = await uploadCsv(eng, smallCsv(), `?retrofitId=${rf.id}`);
    const id = up.body.capture.id;
    const [check] = await db
      .insert(fieldChecks)
      .values({
        revisionId: rev.id,
        technicianId: engineer.id,
        measuredPeriodS: 1e-3,
        measuredHighS: 0.25e-3,
        captureId: id,
        lines: [],
        passed: true,
        signedOffBy: "E. Ngineer",
      })
      .returning({ id: fieldChecks.id });
    const res = await eng.fetch(`/api/v1/captures/${id}`, { method: "DELETE" });
    const body = (await res.json()) as ErrorBody;
    expect(res.status).toBe(409);
    expect(body.error.message).toContain(`#${check.id}`);
    expect((await db.select({ n: count() }).from(captures).where(eq(captures.id, id)))[0].n).toBe(1);
    expect(
      await db.select({ id: revisions.id }).from(revisions).where(eq(revisions.id, rev.id)),
    ).toHaveLength(1);
  });
});
