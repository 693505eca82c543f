// Every CHECKLIST.md line recorded through the field-check API: safety steps
// must be confirmed, typed values are judged against the printed limits, notes
// and a photo are kept, bad input is refused with nothing written, and the
// history names the board, device and target. Checks without lines still work.
import { count, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { fieldCheckPhotos, fieldChecks, retrofits } from "@/db/schema";
import { waitForMail } from "../../helpers/mail";
import { solidPng } from "../../helpers/png";
import { signedIn, type Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { makeRetrofit, makeRevision } from "./fixtures";

type Step = { id: string; text: string; done: boolean; pass: boolean | null; note: string; photoId?: number };
type Check = {
  id: number;
  passed: boolean;
  steps: Step[];
  boardRef: string;
  device: string;
  target: number;
  signedOffBy: string;
};
type Body = { check: Check; error?: { code: string; fields?: Record<string, string> } };

let engineer: Awaited<ReturnType<typeof makeUser>>;
let tech: Session;
let otherSite: Session;
let revisionId: number;
const SAFETY = ["C1", "C2", "C3", "C4", "C5", "C6"];

beforeAll(async () => {
  engineer = await makeUser("engineer");
  const technician = await makeUser("technician", { site: "Test Site North" });
  const stranger = await makeUser("technician", { site: "Test Site South" });
  tech = await signedIn(technician.email, TEST_PASSWORD);
  otherSite = await signedIn(stranger.email, TEST_PASSWORD);
  const r = await makeRetrofit({ createdBy: engineer.id, site: "Test Site North" });
  // Mains-powered and firing a thyristor: the checklist opens with six safety boxes (lib/bundle/safety.ts).
  await db.update(retrofits).set({ mainsPowered: true, drivesThyristor: true }).where(eq(retrofits.id, r.id));
  revisionId = (await makeRevision({ retrofitId: r.id, userId: engineer.id, state: "released" })).id;
});

const post = (body: Record<string, unknown>) =>
  tech.json<Body>("/api/v1/field-checks", { method: "POST", body: JSON.stringify(body) });

const base = { measuredPeriodS: 10e-3, measuredHighS: 2e-3, signedOffBy: "J. Tester" };
const safety = SAFETY.map((id) => ({ id, done: true }));

/** Checks and photos of this file's revision (other files write checks in parallel). */
async function rows() {
  const [c] = await db.select({ n: count() }).from(fieldChecks).where(eq(fieldChecks.revisionId, revisionId));
  const [p] = await db
    .select({ n: count() })
    .from(fieldCheckPhotos)
    .innerJoin(fieldChecks, eq(fieldCheckPhotos.fieldCheckId, fieldChecks.id))
    .where(eq(fieldChecks.revisionId, revisionId));
  return [c.n, p.n];
}

describe("checklist lines with a field check", () => {
  it("keeps the old request shape working (no lines sent, none stored)", async () => {
    const res = await post({ revisionId, ...base });
    expect(res.status).toBe(201);
    expect(res.body.check.passed).toBe(true);
    expect(res.body.check.steps).toEqual([]);
  });

  it("refuses bad lines with a 400 naming the line, and writes nothing", async () => {
    const before = await rows();
    const cases: [Record<string, unknown>[], string][] = [
      [safety.slice(1), "steps.C1.done"], // a safety step not confirmed
      [[...safety, { id: "B99", done: true }], "steps.B99"], // not a line of this checklist
      [[...safety, { id: "S1", measured: "10,4 ms" }], "steps.S1.measured"], // decimal comma
      [[...safety, { id: "S1", measured: "10 V" }], "steps.S1.measured"], // wrong unit for a time
      [
        [
          ...safety,
          {
            id: "S5",
            photo: { mediaType: "image/jpeg", base64: solidPng(4, 4, [1, 2, 3]).toString("base64") },
          },
        ],
        "steps.S5.photo",
      ], // a PNG sent as JPEG
      [[...safety, { id: "S5", photo: { mediaType: "image/png", base64: "not base64!" } }], "steps.S5.photo"],
    ];
    for (const [steps, field] of cases) {
      const res = await post({ revisionId, ...base, steps });
      expect(res.status, field).toBe(400);
      expect(res.body.error?.code).toBe("bad_request");
      expect(Object.keys(res.body.error?.fields ?? {}), field).toContain(field);
    }
    expect(await rows()).toEqual(before);
  });

  it("records ticked and measured lines with a note and a photo, and judges typed values", async () => {
    const png = solidPng(8, 6, [200, 40, 40]);
    const res = await post({
      revisionId,
      ...base,
      steps: [
        ...safety,
        { id: "B1", done: true },
        { id: "B2", done: true, measured: "42 mA", note: "bench supply 12 V" },
        // S1 limits are 10 ms +- 1 us (crystal 50 ppm x 10 ms + one count; see field-checks.test.ts).
        { id: "S1", measured: "10.0005 ms" },
        { id: "S2", measured: "2 ms" },
        {
          id: "S5",
          done: true,
          note: "Pump starts as before.",
          photo: { mediaType: "image/png", base64: png.toString("base64") },
        },
      ],
    });
    expect(res.status).toBe(201);
    const c = res.body.check;
    expect(c.passed).toBe(true);
    const by = Object.fromEntries(c.steps.map((s) => [s.id, s]));
    expect(SAFETY.every((id) => by[id].done && by[id].pass === true)).toBe(true);
    expect(by.C1.text).toMatch(/Isolate the supply and lock it out/);
    expect(by.B2).toMatchObject({ done: true, pass: true, note: "bench supply 12 V" });
    expect(by.B3).toMatchObject({ done: true, pass: true }); // the measured period above
    expect(by.S1).toMatchObject({ done: true, pass: true });
    expect(by.B7).toMatchObject({ done: false, pass: null }); // not done, not invented
    expect(by.S5.note).toBe("Pump starts as before.");
    expect(c.boardRef).toBe("test board");
    expect(c.device).toBe("atmega328p");
    expect(c.target).toBe(0);

    const photo = await tech.fetch(`/api/v1/field-checks/photos/${by.S5.photoId}`);
    expect(photo.status).toBe(200);
    expect(photo.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await photo.arrayBuffer()).equals(png)).toBe(true);
    // Another site's technician cannot read it: same answer as a missing photo.
    expect((await otherSite.fetch(`/api/v1/field-checks/photos/${by.S5.photoId}`)).status).toBe(404);
    expect((await tech.fetch(`/api/v1/field-checks/photos/999999999`)).status).toBe(404);
  });

  it("fails the check when a typed value is outside its printed limits and mails that line", async () => {
    const res = await post({ revisionId, ...base, steps: [...safety, { id: "S1", measured: "10.2 ms" }] });
    expect(res.status).toBe(201);
    expect(res.body.check.passed).toBe(false);
    expect(res.body.check.steps.find((s) => s.id === "S1")!.pass).toBe(false);
    const mail = await waitForMail(engineer.email, /Field check failed/);
    expect(mail.text).toContain("FAIL  S1 Period at the load's input: measured 10.2 ms");
  });
});
