// Point 5 in the browser: the waveform sketch of a measured stage with a
// 16.7 us pulse every 50 ms draws the pulse. Over two periods on a ~1300 px
// chart one pixel is ~77 us, so the pulse is a vertical stroke of the output
// colour from the low to the high level; a sketch sampled on an even grid
// that steps over it leaves the upper part of the chart without any of that
// colour. The numbers are our own scenario (a pump clock's 16.7 us strobe).
import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { stages } from "@/db/schema";
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

/** Pixels of the output colour (#b45309, components/charts/waveform-chart.tsx)
 *  in the band between 10 % and 50 % of the sketch's height: where only the
 *  high level and the strokes up to it are drawn (scale -0.05 .. 1.3). */
async function highBandPixels(page: Page): Promise<number> {
  return page.evaluate(() => {
    const canvas = document.querySelector<HTMLCanvasElement>('[aria-label^="Waveform sketch"] canvas');
    if (!canvas || canvas.width === 0) return -1;
    const ctx = canvas.getContext("2d")!;
    const y0 = Math.floor(canvas.height * 0.1);
    const y1 = Math.floor(canvas.height * 0.5);
    const data = ctx.getImageData(0, y0, canvas.width, y1 - y0).data;
    let n = 0;
    for (let i = 0; i < data.length; i += 4) {
      const [r, g, b, a] = [data[i], data[i + 1], data[i + 2], data[i + 3]];
      if (a > 100 && r > 140 && g > 40 && g < 120 && b < 70) n++;
    }
    return n;
  });
}

describe("waveform sketch in the browser", () => {
  it("draws a 16.7 us pulse in a 50 ms period", async () => {
    const engineer = await makeUser("engineer");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    await db
      .update(stages)
      .set({ values: { kind: "measured", periodS: 50e-3, highS: 16.7e-6 } })
      .where(eq(stages.retrofitId, retrofit.id));
    const { context, page } = await signInAs(browser, engineer.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);
    await page.goto(`/retrofits/${retrofit.id}`);
    await page.locator('[aria-label^="Waveform sketch"] canvas').first().waitFor();
    // Two periods: at least the two pulse strokes, each crossing the band.
    await expect.poll(() => highBandPixels(page)).toBeGreaterThan(10);
    await context.close();
  });
});
