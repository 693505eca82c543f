// Comment threads over the API: anchors (a target's quantity, a register the
// firmware writes, a line of a file), replies, settle / reopen, bad input
// named by field and storing nothing, and the carry-over to later revisions
// with its marks. The register values follow the ATmega328P datasheet
// (Microchip DS40002061, 16.9.3 Fast PWM: TOP = f_clk / (N * f) - 1), so a
// changed RB of the NE555 astable (TI SLFS022, t = 0.693 (RA + 2 RB) C) must
// change ICR1 and leave the mode bits in TCCR1A / TCCR1B as they were.
import { and, eq, like, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { comments, revisionFiles, targets } from "@/db/schema";
import { signedIn, type Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { generate, makeRetrofit, setStageValue } from "./fixtures";

type Err = { error: { code: string; message: string; fields?: Record<string, string> } };
type Thread = {
  id: number;
  anchorKind: string;
  anchorKey: string | null;
  filePath: string | null;
  line: number | null;
  carried: boolean;
  mark: "same" | "changed" | "gone" | null;
  resolvedAt: string | null;
  resolvedBy: string | null;
  replies: { body: string }[];
};
type Threads = { threads: Thread[]; comments: { id: number }[] };
type Created = { comment: { id: number } };

let engineerId: number;
let eng: Session, rev: Session, tech: Session;

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  const reviewer = await makeUser("reviewer");
  const technician = await makeUser("technician");
  engineerId = engineer.id;
  [eng, rev, tech] = await Promise.all([
    signedIn(engineer.email, TEST_PASSWORD),
    signedIn(reviewer.email, TEST_PASSWORD),
    signedIn(technician.email, TEST_PASSWORD),
  ]);
});

const post = (s: Session, revisionId: number, body: unknown) =>
  s.json<Created & Err>(`/api/v1/revisions/${revisionId}/comments`, { method: "POST", body });
const threads = async (revisionId: number) =>
  (await rev.json<Threads>(`/api/v1/revisions/${revisionId}/comments`)).body.threads;
const count = async () => (await db.select({ n: sql<number>`count(*)`.mapWith(Number) }).from(comments))[0].n;

async function mainC(revisionId: number) {
  const [f] = await db
    .select({ path: revisionFiles.path, content: revisionFiles.content })
    .from(revisionFiles)
    .where(and(eq(revisionFiles.revisionId, revisionId), like(revisionFiles.path, "%/src/main.c")));
  return { path: f.path, lines: f.content.split("\n") };
}

describe("comment threads", () => {
  it("anchors to a quantity, a register and a line; replies; settles and reopens", async () => {
    const rf = await makeRetrofit();
    const r1 = await generate(rf.id, engineerId);
    const q = await post(rev, r1.id, {
      body: "Period looks long.",
      anchorKind: "quantity",
      anchorKey: "target1.periodS",
    });
    expect(q.status).toBe(201);
    const reg = await post(rev, r1.id, {
      body: "Why this TOP?",
      anchorKind: "register",
      anchorKey: "target1.register.ICR1",
    });
    expect(reg.status).toBe(201);
    const { path } = await mainC(r1.id);
    expect((await post(rev, r1.id, { body: "Name the table.", filePath: path, line: 3 })).status).toBe(201);
    const reply = await post(eng, r1.id, { body: "Datasheet 16.9.3.", parentId: reg.body.comment.id });
    expect(reply.status).toBe(201);

    let list = await threads(r1.id);
    expect(list.map((t) => t.anchorKind)).toEqual(["quantity", "register", "line"]);
    const regThread = list.find((t) => t.anchorKey === "target1.register.ICR1")!;
    expect(regThread.replies.map((r) => r.body)).toEqual(["Datasheet 16.9.3."]);
    expect(list.every((t) => t.mark === null && !t.carried)).toBe(true);

    const settle = await eng.json<Err>(`/api/v1/comments/${regThread.id}`, {
      method: "PATCH",
      body: { resolved: true },
    });
    expect(settle.status).toBe(200);
    list = await threads(r1.id);
    expect(list.find((t) => t.id === regThread.id)!.resolvedAt).not.toBeNull();
    const reopen = await rev.json<Err>(`/api/v1/comments/${regThread.id}`, {
      method: "PATCH",
      body: { resolved: false },
    });
    expect(reopen.status).toBe(200);
    expect((await threads(r1.id)).find((t) => t.id === regThread.id)!.resolvedAt).toBeNull();
  }, 120_000);

  it("refuses bad anchors, stray replies and technicians, naming the field and storing nothing", async () => {
    const rf = await makeRetrofit();
    const r1 = await generate(rf.id, engineerId);
    const before = await count();
    const cases: [unknown, string][] = [
      [{ body: "x", anchorKind: "register", anchorKey: "target1.register.NOPE" }, "anchorKey"],
      [{ body: "x", anchorKind: "quantity", anchorKey: "target9.periodS" }, "anchorKey"],
      [{ body: "x", anchorKind: "quantity" }, "anchorKey"],
      [{ body: "x", parentId: 2147483647 }, "parentId"],
      [{ body: "x", parentId: 1, anchorKey: "target1.periodS" }, "parentId"],
      [{ body: "x", filePath: "nope.c", line: 1 }, "filePath"],
    ];
    for (const [body, field] of cases) {
      const res = await post(rev, r1.id, body);
      expect([400, 422], JSON.stringify(body)).toContain(res.status);
      expect(Object.keys(res.body.error.fields ?? {}), JSON.stringify(body)).toContain(field);
    }
    const t = await post(tech, r1.id, { body: "x" });
    expect([403, 404]).toContain(t.status);
    const root = await post(rev, r1.id, { body: "root" });
    const reply = await post(eng, r1.id, { body: "answer", parentId: root.body.comment.id });
    const bad = await eng.json<Err>(`/api/v1/comments/${reply.body.comment.id}`, {
      method: "PATCH",
      body: { resolved: true },
    });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields ?? {})).toContain("resolved");
    const odd = await eng.json<Err>(`/api/v1/comments/${root.body.comment.id}`, {
      method: "PATCH",
      body: { resolved: "yes" },
    });
    expect(odd.status).toBe(400);
    expect(Object.keys(odd.body.error.fields ?? {})).toContain("resolved");
    expect(await count()).toBe(before + 2);
  }, 120_000);

  it("carries open threads to the next revisions: same, changed and gone", async () => {
    const rf = await makeRetrofit({ rb: 10e3 });
    const r1 = await generate(rf.id, engineerId);
    const { path, lines } = await mainC(r1.id);
    const icrLine = lines.findIndex((l) => /^\s*ICR1 = /.test(l)) + 1;
    expect(icrLine).toBeGreaterThan(0);
    const add = async (body: object) => (await post(rev, r1.id, { body: "see", ...body })).body.comment.id;
    const period = await add({ anchorKind: "quantity", anchorKey: "target1.periodS" });
    const icr = await add({ anchorKind: "register", anchorKey: "target1.register.ICR1" });
    const mode = await add({ anchorKind: "register", anchorKey: "target1.register.TCCR1B" });
    const icrText = await add({ filePath: path, line: icrLine });
    const first = await add({ filePath: path, line: 1 });
    const settled = await add({});
    await rev.json(`/api/v1/comments/${settled}`, { method: "PATCH", body: { resolved: true } });

    // RB 10 kΩ -> 4.7 kΩ: the period and ICR1 change, the mode bits do not.
    await setStageValue(rf.id, "rb", 4.7e3);
    const r2 = await generate(rf.id, engineerId);
    const on2 = new Map((await threads(r2.id)).map((t) => [t.id, t]));
    expect(on2.has(settled)).toBe(false);
    expect(on2.get(period)).toMatchObject({ carried: true, mark: "changed" });
    expect(on2.get(icr)).toMatchObject({ carried: true, mark: "changed" });
    expect(on2.get(mode)).toMatchObject({ carried: true, mark: "same" });
    expect(on2.get(first)).toMatchObject({ carried: true, mark: "same", line: 1 });
    const moved = on2.get(icrText)!;
    expect(moved.mark).toBe("changed");
    const r2lines = (await mainC(r2.id)).lines;
    expect(r2lines[moved.line! - 1]).toMatch(/^\s*ICR1 = /);
    // r1 still shows its own threads, none carried
    expect((await threads(r1.id)).every((t) => !t.carried)).toBe(true);

    // Toggle mode writes OCR1A and no ICR1: the ICR1 thread's anchor is gone on r3.
    await db.update(targets).set({ mode: "toggle" }).where(eq(targets.retrofitId, rf.id));
    const r3 = await generate(rf.id, engineerId);
    const on3 = new Map((await threads(r3.id)).map((t) => [t.id, t]));
    expect(on3.get(icr)).toMatchObject({ carried: true, mark: "gone" });
    // settled on r2's view: not carried to r3, still shown on r2
    await eng.json(`/api/v1/comments/${mode}`, { method: "PATCH", body: { resolved: true } });
    const r4 = await generate(rf.id, engineerId);
    expect((await threads(r4.id)).some((t) => t.id === mode)).toBe(false);
    expect((await threads(r2.id)).find((t) => t.id === mode)?.resolvedBy).toBeTruthy();
  }, 300_000);
});
