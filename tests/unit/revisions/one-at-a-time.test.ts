// oneAtATime: tasks under one key never overlap and run in the order given; a
// failing task does not stop the next; other keys are not held up.
import { describe, expect, it } from "vitest";
import { oneAtATime } from "@/lib/revisions/one-at-a-time";

const tick = () => new Promise((r) => setTimeout(r, 5));

describe("oneAtATime", () => {
  it("runs tasks of one key one after another, in order, past a failure", async () => {
    const events: string[] = [];
    let running = 0;
    let most = 0;
    const task =
      (name: string, fail = false) =>
      async () => {
        running += 1;
        most = Math.max(most, running);
        events.push(`start ${name}`);
        await tick();
        events.push(`end ${name}`);
        running -= 1;
        if (fail) throw new Error(name);
        return name;
      };
    const results = await Promise.allSettled([
      oneAtATime("a", task("1")),
      oneAtATime("a", task("2", true)),
      oneAtATime("a", task("3")),
    ]);
    expect(most).toBe(1);
    expect(events).toEqual(["start 1", "end 1", "start 2", "end 2", "start 3", "end 3"]);
    expect(results.map((r) => r.status)).toEqual(["fulfilled", "rejected", "fulfilled"]);
  });

  it("lets another key run while one key is busy", async () => {
    let release: () => void = () => undefined;
    const slow = oneAtATime("b", () => new Promise<string>((r) => (release = () => r("slow"))));
    await expect(oneAtATime("c", async () => "other")).resolves.toBe("other");
    release();
    await expect(slow).resolves.toBe("slow");
  });
});
