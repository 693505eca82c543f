// A mains-synchronised firing stage in the workspace, in Debian's chromium:
// the stage's mains fields survive a save and a reload; a zero-cross target
// takes its delay from a wanted load power (50 % = 90 degrees = 5 ms at 50 Hz:
// full-wave AC controller with a resistive load, sin(2a) = 0 at 90 degrees;
// Mohan, Undeland, Robbins, Power Electronics, AC voltage controllers); a bad
// wanted power gets a message and changes nothing; a gate that wants a shorter
// pulse than the plan gives shows "misses" in red with the gate's reason.
// The gate figures are invented test values, not from a thyristor datasheet.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, signInAs } from "../helpers/browser";
import { makeUser, TEST_PASSWORD } from "../helpers/users";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("synchronised stage and zero-cross target in the browser", () => {
  it("delay from a power fraction, bad input refused, gate miss in red, sync kept on save", async () => {
    const eng = await makeUser("engineer");
    const { context, page } = await signInAs(browser, eng.email, TEST_PASSWORD);
    page.setDefaultTimeout(60_000);

    await page.goto("/retrofits/new");
    await page.getByLabel("Name").fill("Dryer heater firing card");
    await page.getByLabel("Site").fill("Browser Test Works");
    await page.getByLabel("Asset tag").fill("BT-HTR-2");
    await page.getByLabel("Drives a thyristor gate").check();
    await page.getByRole("button", { name: "Create retrofit" }).click();
    await page.waitForURL(/\/retrofits\/\d+$/, { timeout: 60_000 });
    const url = page.url();

    const field = (label: string) => page.getByLabel(label, { exact: true });
    await field("Supply voltage (V)").fill("20");
    await field("Timing resistor (Ω)").fill("47k");
    await field("Timing capacitor (F)").fill("100n");
    await field("Intrinsic standoff ratio η (ratio)").fill("0.63");
    await field("Mains frequency (Hz)").fill("50");
    await field("Mains RMS voltage (V)").fill("230");

    await page.getByRole("button", { name: "Add target" }).click();
    const t1 = page.getByRole("group", { name: "Target 1" });
    await t1.getByLabel("Required period tolerance (%)").fill("5");
    await t1.getByLabel("Output starts").selectOption("zero-cross");

    // Bad wanted power: a message, the delay stays as it was.
    const delay = t1.getByLabel("Delay, input edge to pulse (s)");
    await delay.fill("3m");
    await t1.getByLabel("Target 1: wanted load power in percent").fill("150");
    await t1.getByRole("button", { name: "Set the delay" }).click();
    await t1.getByText("Power fraction is a percentage above 0 and at most 100.").waitFor();
    expect(await delay.inputValue()).toBe("3m");

    await t1.getByLabel("Target 1: wanted load power in percent").fill("50");
    await t1.getByRole("button", { name: "Set the delay" }).click();
    await t1.getByText(/firing angle 90\.0°, load power 50\.0 %/).waitFor();
    expect(await delay.inputValue()).toBe("5m");

    // A gate that wants at most 10 us against a 100 us pulse: misses, in red, with the reason.
    await t1.getByLabel("Output pulse width (s)").fill("100u");
    await t1.getByLabel("Gate pulse at most (s)").fill("10u");
    const verdict = page.getByTestId("plans-table").getByTestId("budget-verdict");
    await verdict.and(page.locator('[data-verdict="misses"]')).waitFor();
    expect(await verdict.getAttribute("class")).toMatch(/text-hazard/);
    expect(await verdict.textContent()).toMatch(/gate's maximum 10 µs/);

    // The gate need removed: meets again.
    await t1.getByLabel("Gate pulse at most (s)").fill("");
    await verdict.and(page.locator('[data-verdict="meets"]')).waitFor();

    // Saved and reloaded: the mains fields and the delay are still there.
    await page.getByRole("button", { name: "Save" }).click();
    await page.getByText("Saved.").waitFor();
    await page.goto(url);
    expect(await field("Mains frequency (Hz)").inputValue()).toBe("50");
    expect(await field("Mains RMS voltage (V)").inputValue()).toBe("230");
    expect(
      await page
        .getByRole("group", { name: "Target 1" })
        .getByLabel("Delay, input edge to pulse (s)")
        .inputValue(),
    ).toBe("5m");
    await context.close();
  });
});
