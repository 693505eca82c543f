// GET /api/v1/diff as JSON and as a unified patch, and its read rule:
// technicians may not compare drafts; revisions of two retrofits do not compare.
// Values: NE555 datasheet (TI SLFS022) astable, t_H = 0.693 (RA + RB) C.
import { beforeAll, describe, expect, it } from "vitest";
import { signedIn, type Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { generate, makeRetrofit, setStageValue } from "./fixtures";

let rev: Session, tech: Session;
let ids: { a: number; b: number; other: number };

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  rev = await signedIn((await makeUser("reviewer")).email, TEST_PASSWORD);
  tech = await signedIn((await makeUser("technician")).email, TEST_PASSWORD);
  const rf = await makeRetrofit({ rb: 10e3 });
  const a = await generate(rf.id, engineer.id);
  await setStageValue(rf.id, "rb", 4.7e3);
  const b = await generate(rf.id, engineer.id);
  const other = await generate((await makeRetrofit()).id, engineer.id);
  ids = { a: a.id, b: b.id, other: other.id };
});

describe("diff API", () => {
  it("answers JSON with the changed numbers and per-file rows", async () => {
    const res = await rev.json<{
      numbers: { key: string; before: string; after: string; beforeValue: number; afterValue: number }[];
      files: { path: string; status: string; rows: { kind: string }[] }[];
    }>(`/api/v1/diff?a=${ids.a}&b=${ids.b}`);
    expect(res.status).toBe(200);
    const rb = res.body.numbers.find((n) => n.key === "stage.rb")!;
    expect([rb.before, rb.after]).toEqual(["10 kΩ", "4.7 kΩ"]);
    const high = res.body.numbers.find((n) => n.key === "analysis.highS")!;
    expect(high.beforeValue).toBeCloseTo(0.693 * 11e3 * 1e-6, 4);
    expect(high.afterValue).toBeCloseTo(0.693 * 5.7e3 * 1e-6, 4);
    expect(res.body.numbers.some((n) => n.key === "stage.ra")).toBe(false);
    const modified = res.body.files.filter((f) => f.status === "modified");
    expect(modified.length).toBeGreaterThan(0);
    expect(modified.every((f) => f.rows.some((r) => r.kind === "added" || r.kind === "removed"))).toBe(true);
  });

  it("answers format=patch with a unified diff", async () => {
    const res = await rev.fetch(`/api/v1/diff?a=${ids.a}&b=${ids.b}&format=patch`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/x-diff/);
    const text = await res.text();
    expect(text).toMatch(/^--- a\/\S+\tr1\n\+\+\+ b\/\S+\tr2\n@@ -\d+(,\d+)? \+\d+(,\d+)? @@/m);
  });

  it("hides drafts from technicians, refuses two retrofits, validates ids", async () => {
    expect((await tech.json(`/api/v1/diff?a=${ids.a}&b=${ids.b}`)).status).toBe(404);
    expect((await rev.json(`/api/v1/diff?a=${ids.a}&b=${ids.other}`)).status).toBe(422);
    expect((await rev.json(`/api/v1/diff?a=x&b=${ids.b}`)).status).toBe(400);
    expect((await rev.json(`/api/v1/diff?a=999999999&b=${ids.b}`)).status).toBe(404);
  });
});
