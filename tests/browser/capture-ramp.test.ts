// Point 6 in the browser: a UJT emitter ramp uploaded with its channel and
// probe factor chosen is measured as a ramp (trip and release voltages,
// charge and discharge times, standoff ratio estimate), "use as measured
// stage" picks the retrofit from a list, and the capture page measures the
// same file again with another channel. Expected values are worked out from
// the synthetic file: the sawtooth's extremes are its trip and release
// voltages (capture.md "Ramps"), the square channel's levels its histogram
// modes (IEEE Std 181-2011, 5.2.1.3), eta = (Vp - VD) / VBB (2N2646 data
// sheet, peak-point voltage). The scenario is our own.
import { eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { stages } from "@/db/schema";
import { launch, signInAs } from "../helpers/browser";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit } from "../integration/field/fixtures";

const DT = 10e-6;

/** CH1: the stage's output, 0/5000 mV pulses 4 samples wide every 404;
 *  CH2: the emitter at the scope input, 200 -> 1260 mV over 400 samples and
 *  back in 4 (a 10x probe on a channel left at 1x). */
function emitterCsv(): string {
  const rows = ["Instrument,Bench scope (invented)", "Vertical Units,mV", "Time (s),CH1,CH2"];
  let i = 0;
  for (let c = 0; c < 6; c++) {
    for (let k = 0; k < 404; k++, i++) {
      const v = k < 400 ? 200 + (1060 * k) / 400 : 1260 - (1060 * (k - 400)) / 4;
      rows.push(`${(i * DT).toPrecision(8)},${k >= 400 ? 5000 : 0},${v}`);
    }
  }
  return rows.join("\n") + "\n";
}

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("ramp capture in the browser", () => {
  it("uploads channel 2 through a 10x probe: trip and release shown, stage set on a picked retrofit", async () => {
    const engineer = await makeUser("engineer");
    await makeRetrofit({ createdBy: engineer.id });
    const chosen = await makeRetrofit({ createdBy: engineer.id, site: "Ostberg Valley pump house 2" });

    const { context, page } = await signInAs(browser, engineer.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);
    await page.goto("/captures");
    await page.getByLabel(/CSV or TSV export/).setInputFiles({
      name: "ujt-emitter.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(emitterCsv()),
    });
    await page.getByLabel("Channel", { exact: true }).selectOption("2");
    await page.getByLabel("Probe factor not applied by the scope").selectOption("10");
    await page.getByRole("button", { name: "Upload and measure" }).click();
    const result = page.getByTestId("capture-result");
    await result.waitFor();

    // 1260 mV x 10 = 12.6 V trip, 200 mV x 10 = 2 V release; period 404
    // samples = 4.04 ms, charge 400 samples = 4 ms, discharge 40 us.
    await result.getByTestId("waveform-kind").getByText(/^Ramp/).waitFor();
    const row = (name: string) => result.getByRole("row", { name: new RegExp(`^${name}`) });
    expect(await row("Trip voltage").textContent()).toContain("12.6 V");
    expect(await row("Release voltage").textContent()).toContain("2 V");
    expect(await row("Period").textContent()).toContain("4.04 ms");
    expect(await row("Charge time").textContent()).toContain("4 ms");
    expect(await row("Discharge time").textContent()).toContain("40 µs");
    expect(await result.getByTestId("scaling-note").textContent()).toMatch(
      /Channel 2 of 2 \("CH2"\).*mV \(from a header line\).*× 10 probe factor/,
    );
    // Standoff ratio with a 20 V supply: (12.6 - 0.6) / 20 = 0.6.
    await result.getByLabel(/Supply across the UJT bases/).fill("20");
    await result
      .getByTestId("standoff-ratio")
      .getByText(/standoff ratio ≈ 0\.6 /)
      .waitFor();

    const title = (await result.getByRole("heading", { level: 3 }).textContent()) ?? "";
    const id = Number(/#(\d+)/.exec(title)![1]);
    await page.goto(`/captures/${id}`);
    const picker = page.getByLabel("Retrofit", { exact: true });
    await picker.waitFor();
    await picker.selectOption({
      label: `${chosen.assetTag} · ${chosen.name}`,
    });
    await page.getByRole("button", { name: "Use as measured stage" }).click();
    await page
      .getByRole("status")
      .getByText(`${chosen.assetTag} · ${chosen.name} now has a measured stage`)
      .waitFor();
    const [stage] = await db.select().from(stages).where(eq(stages.retrofitId, chosen.id));
    expect(stage.captureId).toBe(id);
    const values = stage.values as { kind: string; periodS: number; highS: number };
    expect(values.kind).toBe("measured");
    expect(values.periodS).toBeCloseTo(404 * DT, 9);
    // The output pulse flows while the capacitor discharges (capture.md "Ramps").
    expect(values.highS).toBeCloseTo(4 * DT, 9);

    // The same file again, channel 1 as recorded: the output pulse train.
    await page.getByLabel("Channel", { exact: true }).selectOption("1");
    await page.getByLabel("Probe factor not applied by the scope").selectOption("1");
    await page.getByRole("button", { name: "Measure again" }).click();
    await page
      .getByTestId("waveform-kind")
      .getByText(/^Pulse train/)
      .waitFor();
    expect(await page.getByRole("row", { name: /^High time/ }).textContent()).toContain("40 µs");
    expect(await page.getByTestId("scaling-note").textContent()).toMatch(/Channel 1 of 2 \("CH1"\)/);
    await context.close();
  });
});
