// The engineer's workspace end to end in Debian's chromium: create a retrofit,
// enter a UJT stage in engineering notation, watch the analysis follow, add two
// targets, generate r1, download the zip and open it; a technician is refused
// the draft with the "not allowed" page.
import { readFile } from "node:fs/promises";
import { eq } from "drizzle-orm";
import JSZip from "jszip";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { apiTokens, retrofits } from "@/db/schema";
import { analyzeStage, formatEng, type UjtStage } from "@/lib/engine";
import { launch, signInAs } from "../helpers/browser";
import { BASE_URL } from "../helpers/server";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit } from "../integration/field/fixtures";
import { UNSAVED_QUESTION } from "@/components/retrofit/use-unsaved-guard";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** Page object for the retrofit workspace. */
class Workspace {
  constructor(readonly page: Page) {}
  field(label: string) {
    return this.page.getByLabel(label, { exact: true });
  }
  async period(): Promise<string> {
    return (await this.page.getByTestId("analysis-period").textContent()) ?? "";
  }
  async waitForPeriod(text: string) {
    await this.page.getByTestId("analysis-period").filter({ hasText: text }).waitFor({ timeout: 30_000 });
  }
  target(n: number) {
    return this.page.getByRole("group", { name: `Target ${n}` });
  }
}

const expectedPeriod = (s: Omit<UjtStage, "kind">) =>
  formatEng(analyzeStage({ kind: "ujt", ...s }).periodS, "s", 4);

describe("retrofit workspace in the browser", () => {
  it("engineer: create, UJT stage in engineering notation, two targets, r1, zip; technician refused", async () => {
    const eng = await makeUser("engineer");
    const { context, page } = await signInAs(browser, eng.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);

    // Bad input in the create form: field messages, nothing stored.
    await page.goto("/retrofits/new");
    await page.getByRole("button", { name: "Create retrofit" }).click();
    await page.getByText("Name is required.").waitFor();
    await expect.poll(() => page.getByText("Asset tag is required.").isVisible()).toBe(true);
    expect(await db.select().from(retrofits).where(eq(retrofits.createdBy, eng.id))).toHaveLength(0);

    await page.getByLabel("Name").fill("Kiln igniter firing stage");
    await page.getByLabel("Site").fill("Browser Test Works");
    await page.getByLabel("Asset tag").fill("BT-IGN-1");
    await page.getByLabel("Drives a thyristor gate").check();
    await page.getByRole("button", { name: "Create retrofit" }).click();
    await page.waitForURL(/\/retrofits\/\d+$/, { timeout: 60_000 });
    await page.getByRole("note", { name: "Safety caution" }).waitFor();

    const ws = new Workspace(page);
    await ws.field("Supply voltage (V)").fill("20");
    await ws.field("Timing resistor (Ω)").fill("4k7");
    await ws.field("Timing capacitor (F)").fill("100n");
    await ws.field("Intrinsic standoff ratio η (ratio)").fill("0.65");
    const first = expectedPeriod({ supplyV: 20, timingR: 4700, timingC: 100e-9, eta: 0.65 });
    await ws.waitForPeriod(first);
    await expect.poll(() => page.getByTestId("analysis-oscillates").textContent()).toBe("yes");

    // Ten times the resistor: the live analysis follows without a save.
    await ws.field("Timing resistor (Ω)").fill("47k");
    const second = expectedPeriod({ supplyV: 20, timingR: 47e3, timingC: 100e-9, eta: 0.65 });
    expect(second).not.toBe(first);
    await ws.waitForPeriod(second);

    // An unreadable value gets its own message under the field.
    await ws.field("Timing capacitor (F)").fill("1x0n");
    await page.getByText('Cannot read "1x0n" as a value', { exact: false }).waitFor();
    await ws.field("Timing capacitor (F)").fill("100n");
    await ws.field("Timing resistor tolerance in percent").fill("5");

    await page.getByRole("button", { name: "Add target" }).click();
    await page.getByRole("button", { name: "Add target" }).click();
    await ws.target(2).getByLabel("Device").selectOption("stm32g031");
    await ws.target(2).getByLabel("Clock source").selectOption("hsi16");
    const plans = page.getByTestId("plans-table");
    await plans.getByText("STM32G031").waitFor();
    await expect.poll(() => plans.getByText("ATmega328P").isVisible()).toBe(true);

    await page.getByRole("button", { name: "Generate revision r1" }).click();
    const done = page.getByRole("status").getByRole("link", { name: "r1" });
    await done.waitFor({ timeout: 120_000 });
    const href = (await done.getAttribute("href")) ?? "";
    expect(href).toMatch(/^\/revisions\/\d+$/);
    await page.getByTestId("revisions-table").getByText("Prepared").waitFor();

    const [download] = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: "Download r1" }).click(),
    ]);
    expect(download.suggestedFilename()).toBe("clockgraft-BT-IGN-1-r1.zip");
    const zip = await JSZip.loadAsync(await readFile((await download.path())!));
    const names = Object.keys(zip.files);
    for (const device of ["atmega328p", "stm32g031"]) {
      for (const f of ["src/main.c", "PINMAP.md", "CHECKLIST.md"]) expect(names).toContain(`${device}/${f}`);
    }
    expect(names).toContain("plan.json");
    const checklist = await zip.file("atmega328p/CHECKLIST.md")!.async("string");
    expect(checklist).toMatch(/isolate/i); // the thyristor hazard carries the cautions into the bundle

    // The revision page shows the same sha256 as the stored bundle.
    await page.goto(href);
    await page.getByTestId("bundle-sha256").waitFor();
    const sha = (await page.getByTestId("bundle-sha256").textContent())?.trim();
    expect(sha).toMatch(/^[0-9a-f]{64}$/);
    await context.close();

    const tech = await makeUser("technician");
    const t = await signInAs(browser, tech.email, TEST_PASSWORD);
    // A revision outside the technician's read rule answers exactly like a missing one (no existence oracle).
    const res = await t.page.goto(href);
    expect(res?.status()).toBe(404);
    await expect.poll(() => t.page.getByTestId("bundle-sha256").count()).toBe(0);
    await t.context.close();
  });

  it("unsaved edits ask before an in-app link leaves the workspace; after Save nothing asks", async () => {
    const eng = await makeUser("engineer");
    const retrofit = await makeRetrofit({ createdBy: eng.id });
    const { context, page } = await signInAs(browser, eng.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);
    const asked: string[] = [];
    let answer = false;
    page.on("dialog", (d) => {
      asked.push(d.message());
      void (answer ? d.accept() : d.dismiss());
    });
    const url = `/retrofits/${retrofit.id}`;
    await page.goto(url);
    const nav = page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Reviews" });

    // Nothing edited: the link leaves without a question.
    await nav.click();
    await page.waitForURL(/\/reviews$/);
    expect(asked).toEqual([]);

    await page.goto(url);
    await new Workspace(page).field("Period (s)").fill("12m");
    await nav.click(); // dismissed: still here, the edit kept
    await expect.poll(() => asked.length).toBe(1);
    expect(asked[0]).toBe(UNSAVED_QUESTION);
    expect(new URL(page.url()).pathname).toBe(url);
    expect(await new Workspace(page).field("Period (s)").inputValue()).toBe("12m");

    await page.getByRole("button", { name: "Save" }).click();
    await page.getByText("Saved.").waitFor();
    await nav.click();
    await page.waitForURL(/\/reviews$/);
    expect(asked).toHaveLength(1);

    // Accepting the question leaves and drops the edit.
    await page.goto(url);
    await new Workspace(page).field("Period (s)").fill("14m");
    answer = true;
    await nav.click();
    await page.waitForURL(/\/reviews$/);
    expect(asked).toHaveLength(2);
    await context.close();
  });

  it("API tokens: empty name refused, a new token shown once and usable, then revoked", async () => {
    const user = await makeUser("engineer");
    const { context, page } = await signInAs(browser, user.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);
    await page.goto("/settings");
    await page.getByRole("button", { name: "Make token" }).click();
    await page.getByText("Name the token.").waitFor();
    expect(await db.select().from(apiTokens).where(eq(apiTokens.userId, user.id))).toHaveLength(0);

    await page.getByLabel("Token name").fill("bundle fetch");
    await page.getByRole("button", { name: "Make token" }).click();
    await page.getByTestId("new-token").waitFor();
    const secret = ((await page.getByTestId("new-token").textContent()) ?? "").trim();
    expect(secret).toMatch(/^cgt_/);
    const res = await fetch(`${BASE_URL}/api/v1/tokens`, { headers: { authorization: `Bearer ${secret}` } });
    expect(res.status).toBe(200);

    page.once("dialog", (d) => d.accept());
    await page.getByRole("button", { name: "Revoke" }).click();
    await page.getByText(/^revoked /).waitFor();
    const after = await fetch(`${BASE_URL}/api/v1/tokens`, {
      headers: { authorization: `Bearer ${secret}` },
    });
    expect(after.status).toBe(401);
    await page.reload();
    await expect.poll(() => page.getByTestId("new-token").count()).toBe(0); // shown once only
    await context.close();
  });
});
