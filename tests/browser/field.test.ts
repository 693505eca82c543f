// A technician on a phone-sized screen downloads an approved bundle (the zip's
// sha256 matches the one shown), uploads a capture, records a passing and a
// failing check; the engineer then sees both in the retrofit's field history.
import { createHash } from "node:crypto";
import { readFile } from "node:fs/promises";
import { eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { launch, signInAs } from "../helpers/browser";
import { waitForMail } from "../helpers/mail";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit, makeRevision, squareCsv } from "../integration/field/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("field work in the browser", () => {
  it("technician: download, capture, pass and fail; engineer: field history", async () => {
    const engineer = await makeUser("engineer");
    const technician = await makeUser("technician");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    const rev = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "released" });
    const [stored] = await db
      .select({ sha: revisions.bundleSha256 })
      .from(revisions)
      .where(eq(revisions.id, rev.id));

    const { context, page } = await signInAs(browser, technician.email, TEST_PASSWORD, { mobile: true });
    await page.goto("/field");
    const card = page.getByTestId(`asset-${retrofit.assetTag}`);
    await card.waitFor({ timeout: 60_000 });
    // The card fits the 390 px wide screen.
    const box = await card.boundingBox();
    expect(box!.x + box!.width).toBeLessThanOrEqual(390);
    await expect.poll(() => card.getByTestId("bundle-sha").textContent()).toContain(stored.sha.slice(0, 12));

    const [download] = await Promise.all([
      page.waitForEvent("download", { timeout: 60_000 }),
      card.getByRole("link", { name: /Download bundle r1/ }).click(),
    ]);
    const zip = await readFile((await download.path())!);
    // A zip starts with the local file header signature "PK\x03\x04" (APPNOTE.TXT 4.3.7).
    expect(zip.subarray(0, 4).toString("latin1")).toBe("PK\x03\x04");
    expect(createHash("sha256").update(zip).digest("hex")).toBe(stored.sha);

    await card.getByRole("link", { name: /Record check of r1/ }).click();
    await page.waitForURL(new RegExp(`/field/revisions/${rev.id}$`), { timeout: 60_000 });

    // 100 Hz, 2 ms high: the revision's nominal output, sampled every 10 us.
    const csv = squareCsv({ periodS: 10e-3, highS: 2e-3, dtS: 10e-6, periods: 6 });
    await page
      .getByLabel(/CSV or TSV export/)
      .setInputFiles({ name: "tp3.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
    await page.getByRole("button", { name: "Upload and measure" }).click();
    const result = page.getByTestId("capture-result");
    await result.waitFor({ timeout: 60_000 });
    await expect.poll(() => result.getByText("tp3.csv").isVisible()).toBe(true);
    await expect
      .poll(() => result.getByTestId("measurement").getByText("10 ms").first().isVisible())
      .toBe(true);
    await result.locator("canvas").first().waitFor({ timeout: 30_000 });

    await page.getByLabel("Measured period").fill("10 ms");
    await page.getByLabel("Measured high time").fill("2 ms");
    await page.getByRole("button", { name: "Record check" }).click();
    const verdict = page.getByTestId("check-result");
    await verdict.getByText("Check passed").waitFor({ timeout: 30_000 });

    await page.getByLabel("Measured period").fill("10.4 ms");
    await page.getByLabel("Measured high time").fill("2 ms");
    await page.getByLabel("Notes", { exact: true }).fill("Slow after warm-up");
    await page.getByRole("button", { name: "Record check" }).click();
    await verdict.getByText("Check failed").waitFor({ timeout: 30_000 });
    await page.getByTestId("field-check").nth(1).waitFor({ timeout: 30_000 });
    await context.close();

    const mail = await waitForMail(engineer.email, /Field check failed/);
    expect(mail.text).toContain("Slow after warm-up");

    const eng = await signInAs(browser, engineer.email, TEST_PASSWORD);
    await eng.page.goto(`/field/retrofits/${retrofit.id}`);
    const checks = eng.page.getByTestId("field-check");
    await checks.nth(1).waitFor({ timeout: 60_000 });
    await expect.poll(() => checks.count()).toBe(2);
    await expect
      .poll(() => eng.page.locator('[data-testid="field-check"][data-passed="true"]').count())
      .toBe(1);
    await expect
      .poll(() => eng.page.locator('[data-testid="field-check"][data-passed="false"]').count())
      .toBe(1);
    await expect.poll(() => checks.first().getByText("Slow after warm-up").isVisible()).toBe(true);
    await eng.context.close();
  });
});
