// The compare page for a revision that is still building or whose build
// failed: it answers the page (no error screen), says plainly what state the
// build is in (with the failure's reason), and shows the parts that exist
// before a build (the stage's and the plan's numbers, the registers the plan
// sets), while the file text waits for the build. Values: NE555 datasheet (TI
// SLFS022) astable, t_H = ln 2 (RA + RB) C, so RB 10 kΩ -> 4.7 kΩ with RA 1 kΩ
// and C 1 µF moves the high time from 7.625 ms to 3.951 ms; ICR1 = N-count
// period - 1 at 16 MHz / 8 (ATmega328P datasheet, fast PWM with TOP = ICR1).
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { failRevision, startRevision } from "@/lib/revisions/generate";
import { signedIn, type Session } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { generate, makeRetrofit, setStageValue } from "./fixtures";

let reviewer: Session;
let retrofitId: number;
let ids: { ready: number; building: number; failed: number };
const REASON = "avr-gcc stopped: main.c:12: error: stand-in compiler message for this test";

/** The page's visible text: tags and React's text separators gone, spaces squeezed. */
async function pageText(path: string): Promise<{ status: number; text: string }> {
  const res = await reviewer.fetch(path);
  const html = await res.text();
  const body = html
    .replace(/<script[\s\S]*?<\/script>/g, " ")
    .replace(/<!--[\s\S]*?-->/g, "")
    .replace(/<[^>]+>/g, " ")
    .replace(/&amp;/g, "&")
    .replace(/&#x27;|&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/\s+/g, " ");
  return { status: res.status, text: body };
}

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  reviewer = await signedIn((await makeUser("reviewer")).email, TEST_PASSWORD);
  const rf = await makeRetrofit({ rb: 10e3 });
  retrofitId = rf.id;
  const ready = await generate(rf.id, engineer.id);
  await setStageValue(rf.id, "rb", 4.7e3);
  // Started without a queue: no worker ever takes it, so it stays "building".
  const building = await startRevision({ retrofitId: rf.id, userId: engineer.id });
  const failed = await startRevision({ retrofitId: rf.id, userId: engineer.id });
  const [row] = await db
    .select({ progress: revisions.buildProgress })
    .from(revisions)
    .where(eq(revisions.id, failed.id));
  const [folder] = Object.keys(row.progress as Record<string, unknown>);
  await failRevision(failed.id, REASON, folder);
  ids = { ready: ready.id, building: building.id, failed: failed.id };
});

// The first request compiles the page on a dev server.
describe("compare page, revision not built", { timeout: 120_000 }, () => {
  it("says the newer revision is still building and shows its stage and plan numbers", async () => {
    const { status, text } = await pageText(
      `/retrofits/${retrofitId}/compare?a=${ids.ready}&b=${ids.building}`,
    );
    expect(status).toBe(200);
    expect(text).not.toMatch(/Something went wrong|Application error/);
    expect(text).toContain("r2 is still building");
    // Stage numbers: RB as entered, then the analysis (datasheet formula above).
    expect(text).toMatch(/RB \(discharge to threshold\) 10 kΩ 4\.7 kΩ/);
    expect(text).toMatch(/What the board does .* High time 7\.625 ms 3\.951 ms/);
    // 7.2085 ms * 16 MHz / 8 = 14417 counts -> ICR1 = 14416 (r1: 14.556 ms -> 29111), from the plan.
    expect(text).toMatch(/Registers the firmware writes .* ICR1 29111 \(0x71B7\) 14416 \(0x3850\)/);
    // The file text comes with the build, and the page says so instead of listing every file as gone.
    expect(text).toContain("No file text to compare yet: r2 is still building.");
    expect(text).not.toMatch(/Files \(\d+ changed/);
    expect(text).not.toMatch(/\d+ new, \d+ gone/);
  });

  it("says the build failed with its reason, per target too, and still shows the numbers", async () => {
    const { status, text } = await pageText(
      `/retrofits/${retrofitId}/compare?a=${ids.ready}&b=${ids.failed}`,
    );
    expect(status).toBe(200);
    expect(text).toContain("The build of r3 failed");
    expect(text.split(REASON).length - 1).toBeGreaterThanOrEqual(2); // the revision's reason and its target's
    expect(text).toMatch(/What the board does .* High time 7\.625 ms 3\.951 ms/);
    expect(text).toContain("No file text to compare yet: the build of r3 failed.");
  });

  it("names the older side too when that one did not build", async () => {
    const { status, text } = await pageText(
      `/retrofits/${retrofitId}/compare?a=${ids.failed}&b=${ids.building}`,
    );
    expect(status).toBe(200);
    expect(text).toContain("The build of r3 failed");
    expect(text).toContain("r2 is still building");
  });
});

// The diff API for the same pairs: the numbers compare, the files wait, and
// the answer says which side is unbuilt (not every file listed as gone).
describe("diff API, revision not built", { timeout: 120_000 }, () => {
  it("answers the numbers with no files and names the building side", async () => {
    const res = await reviewer.fetch(`/api/v1/diff?a=${ids.ready}&b=${ids.building}`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as {
      numbers: { key: string; before: string; after: string }[];
      files: unknown[];
      unbuilt: { id: number; number: number; buildState: string }[];
    };
    expect(body.files).toEqual([]);
    expect(body.unbuilt).toEqual([{ id: ids.building, number: 2, buildState: "building", buildError: null }]);
    expect(body.numbers.find((n) => n.key === "stage.rb")).toMatchObject({
      before: "10 kΩ",
      after: "4.7 kΩ",
    });
  });

  it("names a failed side with its reason", async () => {
    const res = await reviewer.fetch(`/api/v1/diff?a=${ids.ready}&b=${ids.failed}`);
    const body = (await res.json()) as {
      files: unknown[];
      unbuilt: { buildState: string; buildError: string }[];
    };
    expect(body.files).toEqual([]);
    expect(body.unbuilt).toEqual([expect.objectContaining({ buildState: "failed", buildError: REASON })]);
  });

  it("refuses a patch while a side is unbuilt (409 saying which)", async () => {
    const res = await reviewer.fetch(`/api/v1/diff?a=${ids.ready}&b=${ids.building}&format=patch`);
    expect(res.status).toBe(409);
    const body = (await res.json()) as { error: { message: string } };
    expect(body.error.message).toContain("r2 is still building");
  });

  it("compares files once both sides are built: unbuilt is empty", async () => {
    // The built revision against itself: every file there, each unchanged.
    const res = await reviewer.fetch(`/api/v1/diff?a=${ids.ready}&b=${ids.ready}`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as { files: { status: string }[]; unbuilt: unknown[] };
    expect(body.unbuilt).toEqual([]);
    expect(body.files.length).toBeGreaterThan(0);
    expect(body.files.every((f) => f.status === "unchanged")).toBe(true);
  });
});
