// Point 3 in the browser: with r1 and r2 both awaiting the check, the
// reviewer cannot release the older r1 (only the newest revision that can be
// released becomes the field revision, lib/review/decide.ts); the refusal is
// shown on the review page and r1 stays as it was. Releasing r2 then works.
// Product rule, checked against the stored states; no outside source applies.
import { eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { launch, signInAs } from "../helpers/browser";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit, makeRevision } from "../integration/field/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const stateOf = async (id: number) =>
  (await db.select({ s: revisions.state }).from(revisions).where(eq(revisions.id, id)))[0].s;

describe("stale approval in the browser", () => {
  it("refuses to release the older of two revisions in review, then releases the newer", async () => {
    const engineer = await makeUser("engineer");
    const reviewer = await makeUser("reviewer");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    const r1 = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "awaiting_check" });
    const r2 = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "awaiting_check" });
    const { context, page } = await signInAs(browser, reviewer.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);

    await page.goto(`/revisions/${r1.id}/review`);
    await page.getByRole("button", { name: /^Release r1/ }).click();
    const alert = page
      .getByRole("alert")
      .filter({ hasText: "only the newest revision can become the field revision" });
    await alert.waitFor();
    expect(await alert.textContent()).toContain("r2 is newer");
    expect(await stateOf(r1.id)).toBe("awaiting_check");

    await page.goto(`/revisions/${r2.id}/review`);
    await page.getByRole("button", { name: /^Release r2/ }).click();
    await expect.poll(() => stateOf(r2.id)).toBe("released");
    expect(await stateOf(r1.id)).toBe("awaiting_check");
    await context.close();
  });
});
