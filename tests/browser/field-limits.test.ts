// Issue 18 point 1 in the browser: the field-check form sends the stated
// instrument resolution, echoes what each field read, and the result names
// where each limit comes from; frequency and duty are information, not
// second failures. Limit rule: common practice, no source. Duty = pulse
// duration / period (IEEE Std 181-2011, 3.4), so both derived lines follow
// from the two measured times.
import { eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { targets } from "@/db/schema";
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

describe("field-check limits in the browser", () => {
  it("2 % required, resolution stated: sources shown, derived lines informational", async () => {
    const engineer = await makeUser("engineer");
    const technician = await makeUser("technician");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    await db.update(targets).set({ requiredTolerancePct: 2 }).where(eq(targets.retrofitId, retrofit.id));
    const rev = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "released" });

    const { context, page } = await signInAs(browser, technician.email, TEST_PASSWORD, { mobile: true });
    await page.goto(`/field/revisions/${rev.id}`);
    // 10.15 ms is 1.5 % above the planned 10 ms: inside the required ±2 %.
    await page.getByLabel("Measured period").fill("10m15");
    await page.getByLabel("Measured high time").fill("2 ms");
    await page.getByTestId("check-period-echo").getByText("read as 10.15 ms").waitFor({ timeout: 30_000 });
    // Blank resolution: one step in the third digit of 10.15 ms = 100 us.
    expect(await page.getByTestId("check-resolution-echo").textContent()).toContain("100 µs");
    await page.getByLabel("Instrument resolution").fill("10 us");
    expect(await page.getByTestId("check-resolution-echo").textContent()).toContain("read as 10 µs");
    await page.getByRole("button", { name: "Record check" }).click();
    const verdict = page.getByTestId("check-result");
    await verdict.getByText("Check passed").waitFor({ timeout: 30_000 });
    const sources = await verdict.getByTestId("line-source").allTextContents();
    expect(sources[0]).toContain("limit from required tolerance ±2 % + instrument resolution 10.0 µs");
    expect(sources.filter((s) => s.includes("derived from the measured period and high time")).length).toBe(
      2,
    );

    // 10.4 ms is 4 % off: the period fails; frequency and duty are shown as
    // information and do not add failures of their own.
    await page.getByLabel("Measured period").fill("10.4 ms");
    await page.getByLabel("Measured high time").fill("2 ms");
    await page.getByRole("button", { name: "Record check" }).click();
    await verdict.getByText("Check failed").waitFor({ timeout: 30_000 });
    const results = await verdict.getByTestId("line-result").allTextContents();
    expect(results).toEqual(["Fail", "Pass", "Information", "Information"]);
    await context.close();
  });
});
