// The check loop end to end in the browser: the engineer generates r1 and
// sends it for checking; the checker opens the compare page, comments on a
// line and returns it for rework; the engineer changes one stage value,
// generates r2 and sends it; the checker sees only the changed numbers and
// lines and releases it for the field; the local mail catcher holds the
// messages (please check, returned, released, field revision now r2). The
// line comment left open on r1 is carried to r2 (marked, "from r1"). Timing values: NE555 datasheet (TI SLFS022) astable,
// t_H = 0.693 (RA + RB) C, t_L = 0.693 RB C.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { launch, signInAs } from "../helpers/browser";
import { waitForMail } from "../helpers/mail";
import { makeUser } from "../helpers/users";
import { makeRetrofit, setStageValue, stateOf } from "../integration/review/fixtures";

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const SLOW = { timeout: 120_000 };

async function generate(page: Page, retrofitId: number): Promise<{ id: number; number: number }> {
  // The request context sends the page's cookie but no Origin; a cookie-authenticated
  // change must name our own origin (same-origin rule, lib/api/same-origin.ts).
  const res = await page.request.post(`/api/v1/retrofits/${retrofitId}/revisions?wait=1`, {
    data: {},
    headers: { origin: new URL(process.env.TEST_BASE_URL ?? page.url()).origin },
    timeout: 120_000,
  });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { revision: { id: number; number: number } }).revision;
}

async function submit(page: Page, revisionId: number, number: number) {
  await page.goto(`/revisions/${revisionId}/review`, SLOW);
  await page.getByRole("button", { name: `Send r${number} for checking` }).click(SLOW);
  await page.getByTestId("revision-state").getByText("Awaiting check").waitFor(SLOW);
}

async function decide(page: Page, revisionId: number, button: string | RegExp, note: string, state: string) {
  await page.goto(`/revisions/${revisionId}/review`, SLOW);
  await page.getByLabel(/^Note \(to the engineer/).fill(note);
  await page.getByRole("button", { name: button }).click(SLOW);
  await page.getByTestId("revision-state").getByText(state).waitFor(SLOW);
}

describe("review loop in the browser", () => {
  it("r1 sent, commented, returned; r2 sent, only its changes shown, released; four mails", async () => {
    const site = `Browser review site ${Date.now()}`;
    const engineer = await makeUser("engineer");
    const reviewer = await makeUser("reviewer");
    const technician = await makeUser("technician", { site });
    const rf = await makeRetrofit({ site, rb: 10e3 });

    const eng = await signInAs(browser, engineer.email, engineer.password);
    eng.page.setDefaultTimeout(120_000);
    const r1 = await generate(eng.page, rf.id);
    expect(r1.number).toBe(1);
    await submit(eng.page, r1.id, 1);
    const requested = await waitForMail(
      reviewer.email,
      new RegExp(`Please check: .*${rf.assetTag}\\) r1`),
      60_000,
    );
    expect(requested.text).toContain(`/revisions/${r1.id}/review`);

    // Reviewer: compare page of the first revision (nothing before it), comment on a line of main.c.
    const rev = await signInAs(browser, reviewer.email, reviewer.password);
    rev.page.setDefaultTimeout(120_000);
    await rev.page.goto(`/retrofits/${rf.id}/compare`, SLOW);
    const mainC = rev.page.locator("section[data-file$='src/main.c']");
    await mainC.waitFor(SLOW);
    const path = (await mainC.getAttribute("data-file"))!;
    // Files start closed (a six-device revision stays short); the index opens the one it jumps to.
    await expect
      .poll(() => rev.page.getByRole("button", { name: `Comment on line 5 of ${path}` }).isVisible())
      .toBe(false);
    await rev.page.getByRole("navigation", { name: "File index" }).getByRole("link", { name: path }).click();
    await rev.page.getByRole("button", { name: `Comment on line 5 of ${path}` }).click();
    await rev.page
      .getByLabel(`Comment on ${path} line 5`, { exact: true })
      .fill("Say which datasheet table the prescaler comes from.");
    await rev.page.getByRole("button", { name: "Add comment" }).click();
    const inline = mainC.getByTestId("comment-thread").filter({ hasText: "Say which datasheet table" });
    await inline.waitFor(SLOW);
    await expect.poll(() => inline.isVisible()).toBe(true);
    await decide(
      rev.page,
      r1.id,
      "Return r1 for rework",
      "Name the source of each register value.",
      "Returned for rework",
    );
    await rev.page
      .getByTestId("comment")
      .filter({ hasText: `${path} line 5` })
      .waitFor();
    expect((await stateOf(r1.id)).state).toBe("returned");

    // Engineer: change RB 10 kΩ -> 4.7 kΩ, generate r2, submit.
    await setStageValue(rf.id, "rb", 4.7e3);
    const r2 = await generate(eng.page, rf.id);
    expect(r2.number).toBe(2);
    await submit(eng.page, r2.id, 2);

    // Reviewer: default pair is r2 (in review) against r1; only changed numbers and lines.
    await rev.page.goto(`/retrofits/${rf.id}/compare`, SLOW);
    const numbers = rev.page.getByRole("table", { name: "Numbers that changed" });
    await numbers.waitFor(SLOW);
    const rb = numbers.locator("tr[data-key='stage.rb']");
    await expect.poll(() => rb.textContent()).toContain("10 kΩ");
    await expect.poll(() => rb.textContent()).toContain("4.7 kΩ");
    // NE555: t_H = 0.693 (1 kΩ + 4.7 kΩ) 1 µF = 3.950 ms after the change (0.693 ≈ ln 2; 0.1 % allowed).
    const highText = (await numbers.locator("tr[data-key='analysis.highS'] td").nth(2).textContent()) ?? "";
    const highMs = Number(/([\d.]+) ms/.exec(highText)?.[1]);
    expect(Math.abs(highMs - 0.693 * 5.7e3 * 1e-6 * 1e3) / 3.95).toBeLessThan(1e-3);
    for (const same of ["stage.ra", "stage.c", "stage.supplyV", "target1.device", "target1.clockHz"]) {
      await expect.poll(() => numbers.locator(`tr[data-key='${same}']`).count()).toBe(0);
    }
    // Every shown code line is a change or within 3 lines of one; the rest is folded.
    const api = await rev.page.request.get(`/api/v1/diff?a=${r1.id}&b=${r2.id}`);
    const cmp = (await api.json()) as {
      files: { path: string; status: string; added: number; removed: number }[];
    };
    const changedFiles = cmp.files.filter((f) => f.status !== "unchanged");
    await expect.poll(() => rev.page.locator("section[data-file]").count()).toBe(changedFiles.length);
    const added = changedFiles.reduce((n, f) => n + f.added, 0);
    const removed = changedFiles.reduce((n, f) => n + f.removed, 0);
    await expect.poll(() => rev.page.locator("tr[data-kind='added']").count()).toBe(added);
    await expect.poll(() => rev.page.locator("tr[data-kind='removed']").count()).toBe(removed);
    await expect.poll(() => rev.page.locator("tr[data-kind='fold']").count()).toBeGreaterThan(0);
    // The r1 comment is still open, so r2 carries it, marked and named "from r1".
    const carried = rev.page.getByTestId("comment-thread").filter({ hasText: "Say which datasheet table" });
    await expect.poll(() => carried.count()).toBe(1);
    expect(await carried.getAttribute("data-mark")).toMatch(/^(same|changed)$/);
    expect(await carried.textContent()).toContain("from r1");

    await decide(
      rev.page,
      r2.id,
      "Release r2 for the field",
      "Values and sources check out.",
      "Released for field",
    );
    expect((await stateOf(r2.id)).state).toBe("released");

    const changes = await waitForMail(engineer.email, new RegExp(`Returned: .*${rf.assetTag}\\) r1`), 60_000);
    expect(changes.text).toContain("Name the source of each register value.");
    const approvedDecision = await waitForMail(
      engineer.email,
      new RegExp(`Released: .*${rf.assetTag}\\) r2`),
      60_000,
    );
    expect(approvedDecision.text).toContain("Values and sources check out.");
    const approved = await waitForMail(
      technician.email,
      new RegExp(`Field revision now r2: .*\\(${rf.assetTag}\\)`),
      60_000,
    );
    expect(approved.text).toMatch(/Bundle sha256: [0-9a-f]{64}/);

    await eng.context.close();
    await rev.context.close();
    // Two users, two revisions and a dozen page loads: generous for a busy machine.
  }, 480_000);
});
