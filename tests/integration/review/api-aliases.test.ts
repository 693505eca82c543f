// The API keeps accepting the state and decision values it used before our
// own words (lib/review/words.ts, STATE_ALIASES and DECISION_ALIASES) for one
// release, so existing scripts keep working; every answer uses the new words,
// and a value that is neither gets a message naming the field and changes
// nothing. The contract is our own (product.md "Objects"); no outside source.
import { beforeAll, describe, expect, it } from "vitest";
import { signedIn, type Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { generate, makeRetrofit, stateOf } from "./fixtures";

type Err = { error: { code: string; message: string; fields?: Record<string, string> } };
type Decided = { revision: { id: number; state: string } };
type List = { items: { id: number; latest: { state: string } | null }[] };

let engineerId: number;
let eng: Session, rev: Session;

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  const reviewer = await makeUser("reviewer");
  engineerId = engineer.id;
  [eng, rev] = await Promise.all([
    signedIn(engineer.email, TEST_PASSWORD),
    signedIn(reviewer.email, TEST_PASSWORD),
  ]);
});

async function awaitingCheck(site?: string) {
  const rf = await makeRetrofit(site ? { site } : {});
  const r = await generate(rf.id, engineerId);
  const res = await eng.json(`/api/v1/revisions/${r.id}/submit`, { method: "POST", body: {} });
  expect(res.status).toBe(200);
  return { rf, r };
}

const decide = (id: number, decision: string, note = "Checked against the datasheet table.") =>
  rev.json<Decided & Err>(`/api/v1/revisions/${id}/decision`, { method: "POST", body: { decision, note } });

describe("old API values as aliases", () => {
  for (const [old, now] of [
    ["approved", "released"],
    ["approve", "released"],
    ["changes_requested", "returned"],
    ["request_changes", "returned"],
    ["release", "released"],
    ["return", "returned"],
  ] as const) {
    it(`decision "${old}" is accepted and the answer says "${now}"`, async () => {
      const { r } = await awaitingCheck();
      const res = await decide(r.id, old);
      expect(res.status).toBe(200);
      expect(res.body.revision.state).toBe(now);
      expect((await stateOf(r.id)).state).toBe(now);
      // The answer never carries an old word anywhere.
      expect(JSON.stringify(res.body)).not.toMatch(/approved|changes_requested|in_review|"draft"/);
    });
  }

  it("an unknown decision gets a message naming the field and changes nothing", async () => {
    const { r } = await awaitingCheck();
    const res = await decide(r.id, "ok");
    expect(res.status).toBe(400);
    expect(res.body.error.fields?.decision).toMatch(/decision: send "release" or "return"/);
    expect((await stateOf(r.id)).state).toBe("awaiting_check");
  });

  it("the list filter takes old state values and answers with new ones", async () => {
    const site = `Alias site ${Date.now()}`;
    const { rf } = await awaitingCheck(site);
    for (const value of ["in_review", "awaiting_check"]) {
      const res = await rev.json<List>(
        `/api/v1/retrofits?state=${value}&q=${encodeURIComponent(rf.assetTag)}`,
      );
      expect(res.status).toBe(200);
      expect(res.body.items.map((i) => i.id)).toEqual([rf.id]);
      expect(res.body.items[0].latest?.state).toBe("awaiting_check");
    }
    // An old word for another state filters by that state, so this retrofit is not listed.
    const other = await rev.json<List>(`/api/v1/retrofits?state=draft&q=${encodeURIComponent(rf.assetTag)}`);
    expect(other.status).toBe(200);
    expect(other.body.items).toEqual([]);
  });

  it("an unknown state filter gets a message naming the field", async () => {
    const res = await rev.json<Err>(`/api/v1/retrofits?state=pending`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields?.state).toMatch(
      /state is prepared, awaiting_check, released, returned or none/,
    );
  });
});
