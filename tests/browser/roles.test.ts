// Each demo role signs in, sees the navigation its role allows, opens a page it
// may open and gets the "not allowed" panel on one it may not; sign-out works.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, signInAs } from "../helpers/browser";
import { DEMO } from "../helpers/users";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const CASES = [
  { role: "admin", may: "/admin", mayNot: null, nav: ["Retrofits", "Users", "Audit log"], notNav: [] },
  { role: "engineer", may: "/retrofits", mayNot: "/admin", nav: ["Retrofits", "Field"], notNav: ["Users"] },
  {
    role: "reviewer",
    may: "/reviews",
    mayNot: "/field",
    nav: ["Retrofits", "Reviews"],
    notNav: ["Users", "Field"],
  },
  { role: "technician", may: "/field", mayNot: "/retrofits", nav: ["Field"], notNav: ["Retrofits", "Users"] },
] as const;

describe("roles in the browser", () => {
  for (const c of CASES) {
    it(`${c.role}: navigation, an allowed page, a refused page, sign-out`, async () => {
      const { email, password } = DEMO[c.role];
      const { context, page } = await signInAs(browser, email, password);
      const nav = page.getByRole("navigation", { name: "Main" });
      for (const label of c.nav)
        await expect.poll(() => nav.getByRole("link", { name: label }).isVisible()).toBe(true);
      for (const label of c.notNav)
        await expect.poll(() => nav.getByRole("link", { name: label }).count()).toBe(0);

      await page.goto(c.may);
      await expect.poll(() => page.getByText("Not allowed").count()).toBe(0);

      if (c.mayNot) {
        const res = await page.goto(c.mayNot);
        expect(res?.status()).toBe(200); // a page, not a crash
        const panel = page.getByRole("alert").getByText("Not allowed");
        await panel.waitFor({ timeout: 10_000 });
        await expect.poll(() => panel.isVisible()).toBe(true);
      }

      await page.getByRole("button", { name: "Sign out" }).click();
      await page.waitForURL(/\/sign-in/);
      await page.goto("/retrofits");
      await page.waitForURL(/\/sign-in/);
      await context.close();
    });
  }
});
