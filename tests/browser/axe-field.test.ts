// axe-core scan of the technician's pages at phone width: no serious or
// critical WCAG 2.1 A/AA violation. The scanner is first shown a page with
// planted faults so that a silent or mis-wired scan cannot pass.
import { createHash } from "node:crypto";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { measureCsv } from "@/lib/capture";
import { insertCapture } from "@/lib/field/captures";
import { launch, newContext, signInAs } from "../helpers/browser";
import { seriousViolations } from "../helpers/axe";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit, makeRevision, squareCsv } from "../integration/field/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("accessibility scan (axe-core)", () => {
  it("catches planted faults: a nameless button, an image without alt, grey-on-grey text", async () => {
    const context = await newContext(browser, { mobile: true });
    const page = await context.newPage();
    // WCAG 2.1 SC 4.1.2 (name), 1.1.1 (text alternative), 1.4.3 (contrast 4.5:1).
    await page.setContent(
      `<html lang="en"><head><title>planted</title></head><body><main>
        <button></button><img src="data:image/gif;base64,R0lGODlhAQABAAAAACw=">
        <p style="color:#aaa;background:#bbb">low contrast</p></main></body></html>`,
    );
    const ids = (await seriousViolations(page)).map((v) => v.id);
    expect(ids).toEqual(expect.arrayContaining(["button-name", "image-alt", "color-contrast"]));
    await context.close();
  });

  it("finds no serious or critical violation on the field pages at 390 px", async () => {
    const engineer = await makeUser("engineer");
    const technician = await makeUser("technician");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    const rev = await makeRevision({ retrofitId: retrofit.id, userId: engineer.id, state: "released" });
    const csv = squareCsv({ periodS: 10e-3, highS: 2e-3, dtS: 10e-6, periods: 6 });
    const captureId = await insertCapture({
      retrofitId: retrofit.id,
      uploadedBy: technician.id,
      fileName: "tp3.csv",
      content: Buffer.from(csv),
      sha256: createHash("sha256").update(csv).digest("hex"),
      measurement: await measureCsv(csv),
    });

    const { context, page } = await signInAs(browser, technician.email, TEST_PASSWORD, { mobile: true });
    const found: Record<string, unknown> = {};
    for (const path of [
      "/field",
      `/field/revisions/${rev.id}`,
      `/field/retrofits/${retrofit.id}`,
      "/captures",
      `/captures/${captureId}`,
    ]) {
      await page.goto(path);
      await page.locator("main").waitFor({ timeout: 60_000 });
      await page.waitForLoadState("networkidle");
      const v = await seriousViolations(page);
      if (v.length > 0) found[path] = v;
    }
    expect(found).toEqual({});
    await context.close();
  });
});
