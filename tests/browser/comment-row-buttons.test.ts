// The Comment buttons on the rows of the compare page's board, register and
// changed-number tables: each opens the anchored comment form with its own quantity or
// register chosen, and the saved comment shows up anchored there. The anchors
// are the plan's own (lib/review/anchors.ts): target1.highS for the high time,
// target1.register.OCR1A for the compare register of the ATmega328P's Timer1
// (datasheet, fast PWM with TOP = ICR1: OCR1A sets the high time).
import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { revisions } from "@/db/schema";
import { launch, signInAs } from "../helpers/browser";
import { makeUser } from "../helpers/users";
import { generate, makeRetrofit } from "../integration/review/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const SLOW = { timeout: 120_000 };
const thread = (page: Page, text: string) => page.getByTestId("comment-thread").filter({ hasText: text });

describe("comment buttons on board and register rows", () => {
  it("open the form on their own quantity or register; the comment lands anchored there", async () => {
    const engineer = await makeUser("engineer");
    const reviewer = await makeUser("reviewer");
    const rf = await makeRetrofit();
    const r1 = await generate(rf.id, engineer.id);
    await db
      .update(revisions)
      .set({ state: "awaiting_check", submittedAt: new Date() })
      .where(eq(revisions.id, r1.id));

    const rev = await signInAs(browser, reviewer.email, reviewer.password);
    rev.page.setDefaultTimeout(120_000);
    await rev.page.goto(`/retrofits/${rf.id}/compare?b=${r1.id}`, SLOW);
    const board = rev.page.getByRole("table", { name: "Board timing of target 1" });
    await board.waitFor(SLOW);
    const about = rev.page.getByLabel("About");
    const text = rev.page.getByLabel("Comment", { exact: true });
    expect(await about.inputValue()).toBe("");

    // Board row: the high time.
    const high = board
      .locator("tr[data-key='highS']")
      .getByRole("button", { name: "Comment on target 1 high time" });
    await high.click();
    await expect.poll(() => about.inputValue()).toBe("target1.highS");
    await expect.poll(() => text.evaluate((el) => el === document.activeElement)).toBe(true);
    expect(await high.getAttribute("aria-pressed")).toBe("true");
    await text.fill("High time shorter than the old stage's?");
    await rev.page.getByRole("button", { name: "Save comment" }).click();
    const onHigh = thread(rev.page, "High time shorter than the old stage's?");
    await onHigh.waitFor(SLOW);
    expect(await onHigh.getAttribute("data-anchor")).toBe("target1.highS");
    expect(await onHigh.textContent()).toContain("Target 1 high time");

    // Register row: OCR1A. The form moves from the high time to the register.
    const regs = rev.page.getByRole("table", { name: "Registers of target 1" });
    await regs
      .locator("tr[data-reg='OCR1A']")
      .getByRole("button", { name: "Comment on target 1 OCR1A" })
      .click();
    await expect.poll(() => about.inputValue()).toBe("target1.register.OCR1A");
    await text.fill("OCR1A one count short of the plan?");
    await rev.page.getByRole("button", { name: "Save comment" }).click();
    const onReg = thread(rev.page, "OCR1A one count short of the plan?");
    await onReg.waitFor(SLOW);
    expect(await onReg.getAttribute("data-anchor")).toBe("target1.register.OCR1A");
    expect(await onReg.textContent()).toContain("Target 1 OCR1A");
    // Each comment sits on its own anchor: the first one did not move.
    expect(await onHigh.getAttribute("data-anchor")).toBe("target1.highS");

    // A row of the numbers that changed: the target's period (an anchor too).
    const numbers = rev.page.getByRole("table", { name: "Numbers that changed" });
    await numbers
      .locator("tr[data-key='target1.periodS']")
      .getByRole("button", { name: "Comment on target 1 period" })
      .click();
    await expect.poll(() => about.inputValue()).toBe("target1.periodS");
    await text.fill("Period rounded the right way?");
    await rev.page.getByRole("button", { name: "Save comment" }).click();
    const onPeriod = thread(rev.page, "Period rounded the right way?");
    await onPeriod.waitFor(SLOW);
    expect(await onPeriod.getAttribute("data-anchor")).toBe("target1.periodS");
    // Stage rows are not anchors: no button there.
    expect(await numbers.locator("tr[data-key='stage.kind'] button").count()).toBe(0);
    await rev.context.close();
  }, 300_000);
});
