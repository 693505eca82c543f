// Field checks through the API: limits computed on the server exactly as the
// bundle's checklist prints them, pass and fail, mail to the revision's author
// on a failure, and the approved-only rule for technicians.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { revisionFiles } from "@/db/schema";
import { waitForMail } from "../../helpers/mail";
import { signedIn, type Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { makeRetrofit, makeRevision, squareCsv } from "./fixtures";

type Line = { id: string; min: number; max: number; expected: number; measured: number; pass: boolean };
type Check = { id: number; passed: boolean; lines: Line[]; signedOffBy: string; captureId: number | null };

let engineer: Awaited<ReturnType<typeof makeUser>>;
let tech: Session;
let retrofitId: number;
let approvedId: number;
let draftId: number;
let printed: { id: string; min: number; max: number; expected: number }[];

beforeAll(async () => {
  engineer = await makeUser("engineer");
  const technician = await makeUser("technician", { site: "Test Site North" });
  tech = await signedIn(technician.email, TEST_PASSWORD);
  const retrofit = await makeRetrofit({ createdBy: engineer.id, site: "Test Site North" });
  retrofitId = retrofit.id;
  approvedId = (await makeRevision({ retrofitId, userId: engineer.id, state: "released" })).id;
  draftId = (await makeRevision({ retrofitId, userId: engineer.id, state: "prepared" })).id;
  // The limits as the bundle prints them (plan.json carries the checklist's numbers).
  const files = await db.select().from(revisionFiles).where(eq(revisionFiles.revisionId, approvedId));
  const plan = JSON.parse(files.find((f) => f.path === "plan.json")!.content) as {
    targets: { limits: typeof printed }[];
  };
  printed = plan.targets[0].limits;
});

const post = (s: Session, body: Record<string, unknown>) =>
  s.json<{ check: Check; error?: { code: string } }>("/api/v1/field-checks", {
    method: "POST",
    body: JSON.stringify(body),
  });

describe("field checks", () => {
  it("computes the checklist's limits on the server and passes a board on the nominal timing", async () => {
    // 100 Hz at 16 MHz / 8 / 20000 (ATmega328P datasheet, fast PWM formula):
    // the plan's period is exactly 10 ms, high time exactly 2 ms.
    const res = await post(tech, {
      revisionId: approvedId,
      measuredPeriodS: 10e-3,
      measuredHighS: 2e-3,
      notes: "Counter on TP3, 10 s gate.",
      signedOffBy: "J. Tester",
    });
    expect(res.status).toBe(201);
    const c = res.body.check;
    expect(c.passed).toBe(true);
    expect(c.lines.map((l) => l.id)).toEqual(["period", "high", "frequency", "duty"]);
    for (const l of c.lines) {
      const p = printed.find((x) => x.id === l.id)!;
      expect([l.min, l.expected, l.max]).toEqual([p.min, p.expected, p.max]);
      expect(l.pass).toBe(true);
    }
    const period = c.lines.find((l) => l.id === "period")!;
    expect(period.expected).toBe(10e-3);
    // Band = crystal 50 ppm x 10 ms + one timer count (8 / 16 MHz = 0.5 us)
    // = 1 us (checklist rule; 50 ppm crystal is common practice, no source).
    expect(period.max - period.expected).toBeCloseTo(1e-6, 12);
    // IEEE Std 181-2011: duty = pulse duration / period; frequency = 1 / period.
    expect(c.lines.find((l) => l.id === "duty")!.measured).toBeCloseTo(0.2, 12);
    expect(c.lines.find((l) => l.id === "frequency")!.measured).toBeCloseTo(100, 9);
    expect(c.signedOffBy).toBe("J. Tester");
  });

  it("fails a board 1 % slow and e-mails the revision's author", async () => {
    const res = await post(tech, {
      revisionId: approvedId,
      measuredPeriodS: 10.1e-3,
      measuredHighS: 2e-3,
      notes: "Runs slow after warm-up.",
      signedOffBy: "J. Tester",
    });
    expect(res.status).toBe(201);
    const c = res.body.check;
    expect(c.passed).toBe(false);
    const byId = Object.fromEntries(c.lines.map((l) => [l.id, l]));
    expect(byId.period.pass).toBe(false);
    expect(byId.high.pass).toBe(true);
    expect(byId.frequency.pass).toBe(false);
    const mail = await waitForMail(engineer.email, /Field check failed/);
    expect(mail.text).toContain("FAIL  Period");
    expect(mail.text).toContain("Runs slow after warm-up.");
  });

  it("treats the limits as inclusive (a value on the limit passes, just past it fails)", async () => {
    const period = printed.find((l) => l.id === "period")!;
    const on = await post(tech, {
      revisionId: approvedId,
      measuredPeriodS: period.max,
      measuredHighS: 2e-3,
      signedOffBy: "J. T.",
    });
    expect(on.body.check.lines.find((l) => l.id === "period")!.pass).toBe(true);
    const past = await post(tech, {
      revisionId: approvedId,
      measuredPeriodS: period.max * (1 + 1e-9),
      measuredHighS: 2e-3,
      signedOffBy: "J. T.",
    });
    expect(past.body.check.lines.find((l) => l.id === "period")!.pass).toBe(false);
  });

  it("takes the measured values from an uploaded capture", async () => {
    const csv = squareCsv({ periodS: 10e-3, highS: 2e-3, dtS: 5e-6, periods: 5 });
    const up = await tech.fetch(`/api/v1/captures?retrofitId=${retrofitId}`, {
      method: "POST",
      body: csv,
      headers: { "content-type": "text/csv" },
    });
    expect(up.status).toBe(201);
    const captureId = ((await up.json()) as { capture: { id: number } }).capture.id;
    const res = await post(tech, { revisionId: approvedId, captureId, signedOffBy: "J. Tester" });
    expect(res.status).toBe(201);
    expect(res.body.check.captureId).toBe(captureId);
    expect(res.body.check.passed).toBe(true);
  });

  it("refuses a technician's check on a draft revision (404) and an admin's (409)", async () => {
    const res = await post(tech, {
      revisionId: draftId,
      measuredPeriodS: 10e-3,
      measuredHighS: 2e-3,
      signedOffBy: "J. T.",
    });
    expect(res.status).toBe(404);
    const admin = await makeUser("admin");
    const as = await signedIn(admin.email, TEST_PASSWORD);
    const res2 = await post(as, {
      revisionId: draftId,
      measuredPeriodS: 10e-3,
      measuredHighS: 2e-3,
      signedOffBy: "I. A.",
    });
    expect(res2.status).toBe(409);
  });

  it("hides another site's revision from a technician (404) and refuses engineers (403)", async () => {
    const other = await makeUser("technician", { site: "Somewhere Else" });
    const os = await signedIn(other.email, TEST_PASSWORD);
    const res = await post(os, {
      revisionId: approvedId,
      measuredPeriodS: 10e-3,
      measuredHighS: 2e-3,
      signedOffBy: "X",
    });
    expect(res.status).toBe(404);
    expect((await os.json(`/api/v1/retrofits/${retrofitId}/field-checks`)).status).toBe(404);
    const es = await signedIn(engineer.email, TEST_PASSWORD);
    const res2 = await post(es, {
      revisionId: approvedId,
      measuredPeriodS: 10e-3,
      measuredHighS: 2e-3,
      signedOffBy: "X",
    });
    expect(res2.status).toBe(403);
  });

  it("asks for the missing values and a signature with field errors", async () => {
    const res = await tech.json<{ error: { fields: Record<string, string> } }>("/api/v1/field-checks", {
      method: "POST",
      body: JSON.stringify({ revisionId: approvedId, signedOffBy: " " }),
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.signedOffBy).toMatch(/name/);
  });

  it("lists the history of the retrofit for the engineer, newest first", async () => {
    const es = await signedIn(engineer.email, TEST_PASSWORD);
    const res = await es.json<{ checks: Check[] }>(`/api/v1/retrofits/${retrofitId}/field-checks`);
    expect(res.status).toBe(200);
    expect(res.body.checks.length).toBeGreaterThanOrEqual(5);
    expect(res.body.checks.some((c) => !c.passed)).toBe(true);
    expect(res.body.checks.some((c) => c.passed)).toBe(true);
    const ids = res.body.checks.map((c) => c.id);
    expect([...ids].sort((a, b) => b - a)).toEqual(ids);
    const byRevision = await tech.json<{ checks: Check[] }>(`/api/v1/field-checks?revisionId=${approvedId}`);
    expect(byRevision.body.checks.length).toBe(res.body.checks.length);
  });
});
