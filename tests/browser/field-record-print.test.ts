// Paper for the site: the revision's checklist and pin map print without the
// navigation, each sheet from a new page, with the cautions; a signed field
// check is exported as a PDF that parses (pdf-lib) and carries the signer,
// board, device, results, checklist lines, note and photo.
import { eq } from "drizzle-orm";
import type { Browser } from "playwright-core";
import { PDFName, PDFRawStream } from "pdf-lib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { retrofits } from "@/db/schema";
import { launch, signInAs } from "../helpers/browser";
import { pdfText } from "../helpers/pdf-text";
import { solidPng } from "../helpers/png";
import { makeUser, TEST_PASSWORD } from "../helpers/users";
import { makeRetrofit, makeRevision } from "../integration/field/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function mainsRetrofit(engineerId: number) {
  const retrofit = await makeRetrofit({ createdBy: engineerId });
  await db
    .update(retrofits)
    .set({ mainsPowered: true, drivesThyristor: true })
    .where(eq(retrofits.id, retrofit.id));
  const rev = await makeRevision({ retrofitId: retrofit.id, userId: engineerId, state: "released" });
  return { retrofit, rev };
}

describe("print and PDF record", () => {
  it("prints the checklist and pin map without navigation, a sheet per page, cautions kept", async () => {
    const engineer = await makeUser("engineer");
    const technician = await makeUser("technician");
    const { retrofit, rev } = await mainsRetrofit(engineer.id);
    const { context, page } = await signInAs(browser, technician.email, TEST_PASSWORD);
    await page.goto(`/field/revisions/${rev.id}`);
    await page.getByRole("link", { name: "Print checklist and pin map" }).click();
    const list = page.getByTestId("sheet-checklist-atmega328p");
    await list.waitFor({ timeout: 60_000 });
    const nav = page.getByRole("navigation", { name: "Main" });
    await expect.poll(() => nav.isVisible()).toBe(true);

    await page.emulateMedia({ media: "print" });
    await expect.poll(() => nav.isVisible()).toBe(false);
    await expect.poll(() => page.getByRole("button", { name: "Print" }).isVisible()).toBe(false);
    await expect.poll(() => list.isVisible()).toBe(true);
    expect(await list.textContent()).toContain("Test checklist — ATmega328P");
    expect(await page.getByTestId("sheet-pinmap-atmega328p").textContent()).toContain(retrofit.name);
    // CSS Fragmentation Level 3: the checklist sheet starts a page; headings stay with what follows.
    expect(await list.evaluate((el) => getComputedStyle(el).breakBefore)).toBe("page");
    expect(await list.locator("h2").evaluate((el) => getComputedStyle(el).breakAfter)).toBe("avoid");
    // The mains and thyristor cautions are on both printed sheets.
    for (const sheet of [list, page.getByTestId("sheet-pinmap-atmega328p")]) {
      await expect.poll(() => sheet.getByRole("note").isVisible()).toBe(true);
      expect(await sheet.getByRole("note").textContent()).toMatch(/licensed practice/);
    }
    // Chromium's own print to PDF: the header and pin map on page 1, the checklist from a later page.
    const printed = await pdfText(await page.pdf({ format: "A4" }));
    expect(printed.doc.getPageCount()).toBeGreaterThanOrEqual(2);
    await context.close();
  });

  it("exports a recorded check as a PDF with signer, board, device, results, lines, note and photo", async () => {
    const engineer = await makeUser("engineer");
    const technician = await makeUser("technician");
    const stranger = await makeUser("technician", { site: "Elsewhere" });
    const { retrofit, rev } = await mainsRetrofit(engineer.id);
    const { context, page } = await signInAs(browser, technician.email, TEST_PASSWORD);
    const safety = ["C1", "C2", "C3", "C4", "C5", "C6"].map((id) => ({ id, done: true }));
    const post = (steps: unknown[], signedOffBy: string) =>
      page.request.post("/api/v1/field-checks", {
        data: { revisionId: rev.id, measuredPeriodS: 10e-3, measuredHighS: 2e-3, signedOffBy, steps },
        // The request context sends the cookie but no Origin; a cookie-authenticated change names ours.
        headers: { origin: new URL(process.env.TEST_BASE_URL ?? page.url()).origin },
      });
    const png = solidPng(40, 30, [10, 160, 60]);
    const withLines = await post(
      [
        ...safety,
        { id: "B2", done: true, measured: "42 mA" },
        { id: "S1", measured: "10.0005 ms" },
        {
          id: "S5",
          done: true,
          note: "Pump starts as before.",
          photo: { mediaType: "image/png", base64: png.toString("base64") },
        },
      ],
      "Dana Field",
    );
    expect(withLines.status()).toBe(201);
    const checkId = ((await withLines.json()) as { check: { id: number } }).check.id;
    // A second check without lines: its record must not show the first one's note (negative case).
    const second = await post(safety, "Other Signer");
    expect(second.status()).toBe(201);
    const otherId = ((await second.json()) as { check: { id: number } }).check.id;

    await page.goto(`/field/revisions/${rev.id}`);
    const entry = page.getByTestId("field-check").filter({ hasText: "Dana Field" });
    const [download] = await Promise.all([
      page.waitForEvent("download", { timeout: 60_000 }),
      entry.getByRole("link", { name: /^Export record \(PDF\)/ }).click(),
    ]);
    expect(download.suggestedFilename()).toBe(
      `field-check-${retrofit.assetTag}-r${rev.number}-${checkId}.pdf`,
    );
    const { readFile } = await import("node:fs/promises");
    const bytes = await readFile((await download.path())!);
    expect(bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const { doc, pages } = await pdfText(bytes);
    // Wrapped lines joined with spaces, as they read on paper.
    const text = pages.join(" ").replace(/\n/g, " ");
    expect(doc.getAuthor()).toBe("Dana Field");
    expect(text).toContain("Signed off by Dana Field");
    expect(text.split("Dana Field").length - 1).toBe(1);
    expect(text).toContain("board test board");
    expect(text).toContain("Checked: target 1, ATmega328P");
    expect(text).toContain(`asset ${retrofit.assetTag}`);
    expect(text).toContain(`bundle sha256 ${rev.bundleSha256}`);
    expect(text).toContain("Result: PASSED");
    expect(text).toMatch(/Period: pass, measured 10 ms, limits 9\.999 ms \.\. 10\.001 ms/);
    expect(text).toContain("S1 pass, measured 10.0005 ms: Period at the load's input");
    expect(text).toContain("B2 done, measured 42 mA: Supply current with firmware running");
    expect(text).toContain("Note: Pump starts as before.");
    expect(text).toMatch(/Isolate the supply and lock it out/);
    expect(text).toMatch(/licensed practice/);
    // The photo is embedded as an image of its own size.
    const images = doc.context
      .enumerateIndirectObjects()
      .map(([, o]) => o)
      .filter((o) => o instanceof PDFRawStream && o.dict.get(PDFName.of("Subtype")) === PDFName.of("Image"));
    expect(images.length).toBeGreaterThanOrEqual(1);

    const other = await page.request.get(`/api/v1/field-checks/${otherId}/record`);
    expect(other.status()).toBe(200);
    const otherText = (await pdfText(await other.body())).pages.join(" ").replace(/\n/g, " ");
    expect(otherText).toContain("Signed off by Other Signer");
    expect(otherText).not.toContain("Pump starts as before.");
    await context.close();

    const away = await signInAs(browser, stranger.email, TEST_PASSWORD);
    expect((await away.page.request.get(`/api/v1/field-checks/${checkId}/record`)).status()).toBe(404);
    await away.context.close();
  });
});
