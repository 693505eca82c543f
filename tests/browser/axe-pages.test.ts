// axe-core scan of every page besides the field ones (axe-field.test.ts
// covers those): no serious or critical WCAG 2.1 A/AA violation, signed out,
// as an engineer (desktop and 390 px), a reviewer and an admin. The scanner
// itself is shown planted faults in axe-field.test.ts.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, newContext, signInAs } from "../helpers/browser";
import { seriousViolations, type AxeFinding } from "../helpers/axe";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit, makeRevision } from "../integration/field/fixtures";

const SLOW = 600_000;
let browser: Browser;
let world: { engineer: string; reviewer: string; admin: string; retrofit: number; r1: number; r2: number };

beforeAll(async () => {
  browser = await launch();
  const engineer = await makeUser("engineer");
  const reviewer = await makeUser("reviewer");
  const admin = await makeUser("admin");
  const retrofit = await makeRetrofit({ createdBy: engineer.id });
  const r1 = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "released" });
  const r2 = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "awaiting_check" });
  world = {
    engineer: engineer.email,
    reviewer: reviewer.email,
    admin: admin.email,
    retrofit: retrofit.id,
    r1: r1.id,
    r2: r2.id,
  };
}, SLOW);
afterAll(async () => {
  await browser?.close();
});

async function scan(page: Page, paths: string[]): Promise<Record<string, AxeFinding[]>> {
  const found: Record<string, AxeFinding[]> = {};
  for (const path of paths) {
    await page.goto(path, { timeout: 120_000 });
    await page.locator("main").first().waitFor({ timeout: 120_000 });
    await page.waitForLoadState("networkidle", { timeout: 120_000 });
    const v = await seriousViolations(page);
    if (v.length > 0) found[path] = v;
  }
  return found;
}

async function scanAs(email: string, paths: string[], mobile = false) {
  const { context, page } = await signInAs(browser, email, TEST_PASSWORD, { mobile });
  const found = await scan(page, paths);
  await context.close();
  return found;
}

describe("accessibility scan of every page (axe-core)", () => {
  it("sign-in page, signed out", { timeout: SLOW }, async () => {
    const context = await newContext(browser);
    expect(await scan(await context.newPage(), ["/sign-in"])).toEqual({});
    await context.close();
  });

  const enginePages = () => [
    "/retrofits",
    "/retrofits/new",
    `/retrofits/${world.retrofit}`,
    `/revisions/${world.r1}`,
    `/retrofits/${world.retrofit}/compare?a=${world.r1}&b=${world.r2}`,
    "/settings",
  ];
  it("engineer pages on the desktop", { timeout: SLOW }, async () => {
    expect(await scanAs(world.engineer, enginePages())).toEqual({});
  });
  it("engineer pages at 390 px", { timeout: SLOW }, async () => {
    expect(await scanAs(world.engineer, enginePages(), true)).toEqual({});
  });
  it("reviewer pages", { timeout: SLOW }, async () => {
    expect(await scanAs(world.reviewer, ["/reviews", `/revisions/${world.r2}/review`])).toEqual({});
  });
  it("admin pages", { timeout: SLOW }, async () => {
    expect(await scanAs(world.admin, ["/admin", "/audit"])).toEqual({});
  });
});
