// Paper copies and the tab icon: printing a field revision page leaves out the
// navigation and buttons but keeps the content; every page links our favicon
// and it is served (it was a 404 on every page).
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
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

describe("print stylesheet and favicon", () => {
  it("prints without navigation or buttons, keeps the content, and serves the icon", async () => {
    const engineer = await makeUser("engineer");
    const technician = await makeUser("technician");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    const rev = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "released" });
    const { context, page } = await signInAs(browser, technician.email, TEST_PASSWORD);
    await page.goto(`/field/revisions/${rev.id}`);
    const nav = page.getByRole("navigation", { name: "Main" });
    await nav.waitFor({ timeout: 60_000 });
    const button = page.getByRole("button", { name: "Record check" });
    await expect.poll(() => button.isVisible()).toBe(true);

    // Code views show |=, != and -> as typed: ligatures off (CSS Fonts Level 4, font-variant-ligatures).
    const lig = await page
      .getByTestId("bundle-sha")
      .first()
      .evaluate((el) => getComputedStyle(el).fontVariantLigatures);
    expect(lig).toBe("none");

    await page.emulateMedia({ media: "print" });
    await expect.poll(() => nav.isVisible()).toBe(false);
    await expect.poll(() => button.isVisible()).toBe(false);
    await expect
      .poll(() => page.getByRole("heading", { level: 1 }).textContent())
      .toContain(retrofit.assetTag);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).isVisible()).toBe(true);
    await page.emulateMedia({ media: "screen" });
    await expect.poll(() => nav.isVisible()).toBe(true);

    const href = await page.locator('head link[rel="icon"]').first().getAttribute("href");
    expect(href).toMatch(/icon/);
    const res = await page.request.get(href!);
    expect(res.status()).toBe(200);
    expect(res.headers()["content-type"]).toContain("image/svg+xml");
    expect(await res.text()).toContain("<svg");
    await context.close();
  });
});
