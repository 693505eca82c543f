// The whole checklist from a phone (390 px): on a mains-powered retrofit that
// fires a thyristor, the technician confirms the safety steps, measures the
// supply current and the on-site period, ticks the load response with a note
// and a photo, and records; the history entry names the board, device and
// target and the signer once. Recording without a safety step is refused.
import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { retrofits } from "@/db/schema";
import { launch, signInAs } from "../helpers/browser";
import { solidPng } from "../helpers/png";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit, makeRevision } from "../integration/field/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const sideways = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

describe("checklist lines on the phone", () => {
  it("ticks, measures, notes and photographs every kind of line and records them", async () => {
    const engineer = await makeUser("engineer");
    const technician = await makeUser("technician");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    await db
      .update(retrofits)
      .set({ mainsPowered: true, drivesThyristor: true })
      .where(eq(retrofits.id, retrofit.id));
    const rev = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "released" });

    const { context, page } = await signInAs(browser, technician.email, TEST_PASSWORD, { mobile: true });
    await page.goto(`/field/revisions/${rev.id}`);
    const lines = page.getByTestId("checklist-lines");
    await lines.waitFor({ timeout: 60_000 });
    // The cautions stay on the page and open the checklist itself.
    await expect.poll(() => page.getByRole("note").first().textContent()).toMatch(/thyristor/i);
    await expect.poll(() => page.getByTestId("line-C1").textContent()).toMatch(/lock it out/);

    await page.getByLabel("Measured period").fill("10 ms");
    await page.getByLabel("Measured high time").fill("2 ms");
    // Recording with the safety steps unconfirmed is refused on the page.
    await page.getByRole("button", { name: "Record check" }).click();
    await page.getByTestId("line-C1").getByText("Confirm this safety step.").waitFor();
    await expect.poll(() => page.getByTestId("check-result").count()).toBe(0);

    for (const id of ["C1", "C2", "C3", "C4", "C5", "C6"]) {
      await page.getByTestId(`line-${id}`).getByRole("checkbox").check();
    }
    await page.getByTestId("line-B1").getByRole("checkbox").check();
    await page.getByLabel("Measured B2").fill("42 mA");
    await page.getByTestId("line-B2").getByRole("checkbox").check();
    // S1 limits are 10 ms +- 1 us (see tests/integration/field/field-checks.test.ts); the echo says so.
    await page.getByLabel("Measured S1").fill("10.0005 ms");
    await expect.poll(() => page.getByTestId("line-S1-echo").textContent()).toMatch(/within limits/);
    await page.getByLabel("Measured S2").fill("2.5 ms");
    await expect.poll(() => page.getByTestId("line-S2-echo").textContent()).toMatch(/outside the limits/);
    await page.getByLabel("Measured S2").fill("2 ms");
    const s5 = page.getByTestId("line-S5");
    await s5.getByRole("checkbox").check();
    await s5.getByText("Note or photo").click();
    await page.getByLabel("Note for S5").fill("Pump starts as before.");
    await page.getByLabel("Photo for S5").setInputFiles({
      name: "pump.png",
      mimeType: "image/png",
      buffer: solidPng(2400, 1800, [30, 120, 200]),
    });
    // The preview is the browser's downscaled JPEG (longer side 1600 px).
    const preview = s5.getByRole("img", { name: "Photo for S5" });
    await preview.waitFor();
    await expect.poll(() => preview.evaluate((i: HTMLImageElement) => i.naturalWidth)).toBe(1600);
    await expect.poll(() => sideways(page)).toBeLessThanOrEqual(0);

    await page.getByRole("button", { name: "Record check" }).click();
    const result = page.getByTestId("check-result");
    await result.getByText("Check passed").waitFor({ timeout: 30_000 });
    await expect
      .poll(() => result.getByTestId("step-count").textContent())
      .toMatch(/^1[0-9] of 1[0-9] checklist lines done\.$/);
    await expect.poll(() => result.getByTestId("step-S1").textContent()).toMatch(/Pass · 10.0005 ms/);
    await expect.poll(() => result.getByTestId("step-B7").textContent()).toMatch(/Not done/);

    const entry = page.getByTestId("field-check").first();
    await expect
      .poll(() => entry.getByTestId("checked-what").textContent())
      .toBe("board test board · ATmega328P · target 1");
    const signed = (await entry.getByTestId("signed-off").textContent()) ?? "";
    expect(signed).toBe(`Signed off by ${technician.name}`);
    expect(((await entry.textContent()) ?? "").split(technician.name).length - 1).toBe(1);
    await entry.getByText("Checklist lines", { exact: true }).click();
    const stored = entry.getByTestId("step-S5").getByRole("img", { name: "Photo for S5" });
    await stored.scrollIntoViewIfNeeded(); // loaded lazily, as the technician scrolls to it
    const src = (await stored.getAttribute("src"))!;
    expect((await page.request.get(src)).headers()["content-type"]).toBe("image/jpeg");
    await expect
      .poll(() => stored.evaluate((i: HTMLImageElement) => i.complete && i.naturalWidth))
      .toBe(1600);
    await expect
      .poll(() => entry.getByTestId("step-S5").textContent())
      .toContain("Note: Pump starts as before.");
    await expect.poll(() => sideways(page)).toBeLessThanOrEqual(0);
    await context.close();
  });
});
