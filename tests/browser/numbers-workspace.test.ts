// Issue 18 points 2, 4 and 5 in the browser. Facts: RP2040 datasheet 2.18.2
// (PLL_SYS from the 12 MHz crystal: VCO 750..1600 MHz, POSTDIV1/2 1..7, so
// 16 MHz is no PLL output; 18 MHz is one the engine.s
// frequency list holds). Presentation rules: SI prefixes (SI Brochure 9th
// edition, 3), thousands separators: common practice, no source.
import { eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { stages, targets } from "@/db/schema";
import { isEngineError, planTarget } from "@/lib/engine";
import { plainMessage } from "@/lib/validation/plain-message";
import { launch, signInAs } from "../helpers/browser";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit } from "../integration/field/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

function plannerMessage(): string {
  try {
    planTarget({ device: "rp2040", clockSource: "xosc-pll", clockHz: 16e6, periodS: 50e-3, highS: 16.7e-6 });
  } catch (e) {
    if (isEngineError(e)) return e.message;
    throw e;
  }
  throw new Error("the planner accepted 16 MHz from PLL_SYS");
}

describe("numbers in the workspace", () => {
  it("one clock rule live and on generate; parsed values echoed; the sketch draws a measured output", async () => {
    const engineer = await makeUser("engineer");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    // A target stored before the rule: 16 MHz from the RP2040's PLL, which it cannot make.
    await db
      .update(targets)
      .set({ device: "rp2040", clockSource: "xosc-pll", clockHz: 16e6 })
      .where(eq(targets.retrofitId, retrofit.id));
    await db
      .update(stages)
      .set({ values: { kind: "measured", periodS: 50e-3, highS: 16.7e-6 } })
      .where(eq(stages.retrofitId, retrofit.id));

    const { context, page } = await signInAs(browser, engineer.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);
    await page.goto(`/retrofits/${retrofit.id}`);
    const target = page.getByRole("group", { name: "Target 1" });
    const clock = target.getByLabel("Clock frequency (Hz)");
    await clock.waitFor();

    // Point 4: the clock field reads "16M", never rewritten to "16000000";
    // device names as the datasheet writes them; stage values echoed.
    expect(await clock.inputValue()).toBe("16M");
    expect(await target.getByLabel("Device").locator("option:checked").textContent()).toBe("RP2040");
    expect(await page.getByTestId("stage-highS-echo").textContent()).toBe("read as 16.7 µs");
    await page.getByLabel("Period (s)", { exact: true }).fill("50m0");
    await page.getByTestId("stage-periodS-echo").getByText("read as 50 ms").waitFor();

    // Point 2, server side: generation refuses with a 422 naming the clock
    // field, in the planner's own words.
    const res = await page.evaluate(async (id) => {
      const r = await fetch(`/api/v1/retrofits/${id}/revisions`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: "{}",
      });
      return { status: r.status, body: (await r.json()) as { error: { fields?: Record<string, string> } } };
    }, retrofit.id);
    expect(res.status).toBe(422);
    const expected = plainMessage(plannerMessage());
    expect(expected).toContain("cannot make 16 MHz");
    expect(res.body.error.fields?.["targets.0.clockHz"]).toBe(expected);

    // Point 2, browser side: the same rule marks the same field with the same words.
    await clock.fill("16,000,000");
    const err = target.locator("#target-0-clockHz-error");
    await err.waitFor();
    expect(await err.textContent()).toBe(expected);
    expect(await clock.getAttribute("aria-invalid")).toBe("true");

    // A frequency the PLL makes, typed with thousands separators, is read and echoed.
    await clock.fill("18,000,000");
    await target.getByTestId("target-0-clockHz-echo").getByText("read as 18 MHz").waitFor();
    expect(await err.count()).toBe(0);

    // Point 5: the sketch of a measured stage names what it draws.
    const legend = page.locator(".u-legend");
    await legend.first().waitFor();
    const text = (await legend.first().textContent()) ?? "";
    expect(text).toContain("measured output");
    expect(text).not.toContain("capacitor");
    await context.close();
  });
});
