// Which sides of a compared pair lack built files (lib/diff/unbuilt.ts): the
// product's own rule, used by the compare page and GET /api/v1/diff.
import { describe, expect, it } from "vitest";
import { NOTHING_ID, unbuiltFilesSentence, unbuiltOf } from "@/lib/diff/unbuilt";

type State = "building" | "ready" | "failed";
const side = (id: number, number: number, buildState: State) => ({ id, number, buildState });

describe("unbuiltOf", () => {
  it("keeps building and failed sides, in order, and drops ready ones", () => {
    const got = unbuiltOf([side(7, 2, "failed"), side(8, 3, "ready"), side(9, 4, "building")]);
    expect(got.map((r) => r.id)).toEqual([7, 9]);
    // The narrowed type: a "ready" state can no longer be assigned to the result's state.
    const states: ("building" | "failed")[] = got.map((r) => r.buildState);
    expect(states).toEqual(["failed", "building"]);
  });

  it("counts the empty start side as built whatever its state", () => {
    expect(unbuiltOf([side(NOTHING_ID, 0, "building"), side(3, 1, "ready")])).toEqual([]);
  });

  it("says why the files wait, one clause per side", () => {
    const got = unbuiltOf([side(4, 2, "building"), side(5, 3, "failed")]);
    expect(unbuiltFilesSentence(got)).toBe(
      "No file text to compare yet: r2 is still building; the build of r3 failed.",
    );
  });
});
