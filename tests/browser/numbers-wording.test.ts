// Issue 18 point 4 in the browser: the workspace prints numbers people can
// read. The formatters themselves are unit-tested in
// tests/unit/validation/presentation.test.ts (formatPpm, plainMessage,
// echoText, defaultText); this test checks the pages use them.
// The case: an old stage measured at 50 ms with a 16.7 µs pulse, moved to an
// ATtiny85 on its 128 kHz internal oscillator. Timer1 is 8-bit with
// power-of-two prescalers (ATtiny85 datasheet, Timer/Counter1, from memory):
// 50 ms is 6400 clocks, so the prescaler is at least 32 and one count is
// 250 µs, about 15 times the pulse asked for. Where ppm stops being readable
// (10 000 ppm = 1 %) is common practice, no source; SI prefixes: SI Brochure,
// 9th edition, 3.
import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { stages, targets } from "@/db/schema";
import { formatPpm, listDevices, planTarget, STAGE_FIELDS } from "@/lib/engine";
import { defaultText, echoText } from "@/lib/validation/form-text";
import { plainMessage } from "@/lib/validation/plain-message";
import { launch, signInAs } from "../helpers/browser";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit } from "../integration/field/fixtures";

const PERIOD_S = 50e-3;
const HIGH_S = 16.7e-6;

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** The text of one row of the plans table, first target's cell. */
async function planCell(page: Page, row: string): Promise<string> {
  const tr = page
    .getByTestId("plans-table")
    .locator("tr", { has: page.getByRole("rowheader", { name: row }) });
  return ((await tr.locator("td").first().textContent()) ?? "").trim();
}

/** Every "<number> ppm" on the page whose size is past the readable range. */
function unreadablePpm(text: string): string[] {
  return [...text.matchAll(/([+-]?[\d,]*\.?\d+(?:e[+-]?\d+)?)\s*ppm/gi)]
    .filter((m) => Math.abs(Number(m[1].replace(/,/g, ""))) >= 10_000)
    .map((m) => m[0]);
}

/** Seconds written without a prefix where one belongs: "0.00001671 s", "5e-7 s". */
function rawSeconds(text: string): string[] {
  return [...text.matchAll(/(?:\b0\.000\d*|\d(?:\.\d+)?e[+-]?\d+)\s*s\b/gi)].map((m) => m[0]);
}

describe("numbers in the workspace read as people write them", () => {
  it("% or a ratio past ppm, engineering units, datasheet device names, fields that keep and echo", async () => {
    const engineer = await makeUser("engineer");
    const retrofit = await makeRetrofit({ createdBy: engineer.id });
    await db
      .update(stages)
      .set({ values: { kind: "measured", periodS: PERIOD_S, highS: HIGH_S } })
      .where(eq(stages.retrofitId, retrofit.id));
    await db
      .update(targets)
      .set({ device: "attiny85", clockSource: "rc128k", clockHz: 128e3, requiredTolerancePct: 1 })
      .where(eq(targets.retrofitId, retrofit.id));
    const plan = planTarget({
      device: "attiny85",
      clockSource: "rc128k",
      clockHz: 128e3,
      mode: "pwm",
      periodS: PERIOD_S,
      highS: HIGH_S,
    });
    // The case is what it should be: the pulse misses by far more than 100 %.
    expect(plan.highS).toBeGreaterThanOrEqual(250e-6);
    expect(plan.highErrorPpm).toBeGreaterThan(1e6);

    const { context, page } = await signInAs(browser, engineer.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);
    await page.goto(`/retrofits/${retrofit.id}`);
    await page.getByTestId("plans-table").waitFor();

    // An error past 100 % is a ratio to the target, printed by the unit-tested formatter.
    const highError = await planCell(page, "High time error");
    expect(highError).toBe(formatPpm(plan.highErrorPpm, 3));
    const ratio = Number(/^([\d.]+) × the target$/.exec(highError)?.[1]);
    expect(ratio).toBeCloseTo(plan.highS / HIGH_S, 0);

    // Engineering units in cells and notes: "250 µs", never "0.00025 s".
    expect(await planCell(page, "Achieved high time")).toMatch(/^\d+(?:\.\d+)? [µm]?s$/);
    const notes = await planCell(page, "Notes");
    for (const n of plan.notes) expect(notes).toContain(plainMessage(n));
    expect(notes).toContain("16.7 µs");

    // Device names as the datasheet writes them, never the lower-case id.
    expect(await planCell(page, "Device")).toBe("ATtiny85");
    const target = page.getByRole("group", { name: "Target 1" });
    expect(await target.getByLabel("Device").locator("option:checked").textContent()).toBe("ATtiny85");

    // Nowhere on the page: ppm past the readable range, bare seconds, device ids.
    const main = (await page.locator("main").innerText()).replace(/\s+/g, " ");
    expect(unreadablePpm(main)).toEqual([]);
    expect(rawSeconds(main)).toEqual([]);
    for (const d of listDevices()) expect(main).not.toMatch(new RegExp(`\\b${d.id}\\b`));

    // The clock field keeps what was typed and echoes what it read.
    const clock = target.getByLabel("Clock frequency (Hz)");
    expect(await clock.inputValue()).toBe("128k");
    expect(echoText("0.128M", "Hz")).toBe("128 kHz");
    await clock.fill("0.128M");
    await target.getByTestId("target-0-clockHz-echo").getByText("read as 128 kHz").waitFor();
    expect(await clock.inputValue()).toBe("0.128M");

    // Another stage kind: a resistance typed as "1m5" echoes its parsed value,
    // and defaults read in their unit ("default 5 µA", not 0.000005).
    await page.getByLabel("Stage kind").selectOption("ujt");
    const rbb = page.getByLabel("Interbase resistance RBB (Ω), optional");
    await rbb.fill("1m5");
    const echo = page.getByTestId("stage-interbaseR-echo");
    await echo.waitFor();
    expect(await echo.textContent()).toBe(`read as ${echoText("1m5", "Ω")}`);
    expect(echoText("1m5", "Ω")).toBe("1.5 mΩ");
    const peak = STAGE_FIELDS.ujt.find((f) => f.name === "peakCurrentA")!;
    const placeholder = await page.getByLabel("Peak-point current (A), optional").getAttribute("placeholder");
    expect(placeholder).toBe(defaultText(peak.default as number, "A"));
    expect(placeholder).toMatch(/^default [\d.]+ µA$/);
    await context.close();
  });
});
