// Polish: selects show their chosen text whole and stay on screen, at 390 px
// and on the desktop: each select is at least as wide as the browser makes
// a copy holding only its chosen option. A select squeezed to 40 px is
// planted first, so the check is seen to fail. Product rule, no outside source.
import { createHash } from "node:crypto";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { measureCsv } from "@/lib/capture";
import { insertCapture } from "@/lib/field/captures";
import { launch, signInAs } from "../helpers/browser";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit, squareCsv } from "../integration/field/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** Selects whose chosen text is cut or which reach past the viewport. A
 *  copy of each select holding only its chosen option, at its natural
 *  width, is the width the browser needs to show that text whole. */
async function badSelects(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const s of Array.from(document.querySelectorAll("select"))) {
      const r = s.getBoundingClientRect();
      if (r.width === 0) continue; // hidden
      const text = s.selectedOptions[0]?.text ?? "";
      const copy = s.cloneNode(false) as HTMLSelectElement;
      copy.removeAttribute("id");
      copy.append(new Option(text));
      Object.assign(copy.style, {
        width: "auto",
        minWidth: "0",
        maxWidth: "none",
        position: "absolute",
        visibility: "hidden",
      });
      s.parentElement!.append(copy);
      const needed = copy.getBoundingClientRect().width;
      copy.remove();
      const name = s.id || s.name || text;
      if (needed > r.width + 0.5) out.push(`${name}: "${text}" cut`);
      if (r.right > document.documentElement.clientWidth + 0.5) out.push(`${name}: off screen`);
    }
    return out;
  });
}

describe("selects fit their text", () => {
  it("on the workspace and the capture page, at 390 px and desktop", { timeout: 600_000 }, async () => {
    const engineer = await makeUser("engineer");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    const csv = squareCsv({ periodS: 10e-3, highS: 2e-3, dtS: 10e-6, periods: 6 });
    const captureId = await insertCapture({
      retrofitId: retrofit.id,
      uploadedBy: engineer.id,
      fileName: "tp3.csv",
      content: Buffer.from(csv),
      sha256: createHash("sha256").update(csv).digest("hex"),
      measurement: await measureCsv(csv),
    });
    const found: Record<string, string[]> = {};
    for (const mobile of [true, false]) {
      const { context, page } = await signInAs(browser, engineer.email, TEST_PASSWORD, { mobile });
      page.setDefaultTimeout(60_000);
      for (const path of [`/retrofits/${retrofit.id}`, `/captures/${captureId}`, "/captures"]) {
        await page.goto(path);
        await page.locator("select").first().waitFor();
        await page.waitForLoadState("networkidle");
        if (mobile && path === `/captures/${captureId}`) {
          // Planted fault: a squeezed select must be reported.
          const planted = page.locator("select").first();
          const id = await planted.getAttribute("id");
          await planted.evaluate((el) => (el.style.width = "40px"));
          expect(await badSelects(page)).toContain(
            `${id}: "${await planted.locator("option:checked").textContent()}" cut`,
          );
          await page.reload();
          await page.locator("select").first().waitFor();
        }
        const bad = await badSelects(page);
        if (bad.length > 0) found[`${mobile ? "390" : "desktop"} ${path}`] = bad;
      }
      await context.close();
    }
    expect(found).toEqual({});
  });
});
