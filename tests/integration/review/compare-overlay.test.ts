// The compare page overlays both revisions' emulated pin outputs per target
// and says the emulated period and high time old -> new. Real generator with
// simavr (Debian libsimavr-dev) on the ATmega328P. Expected values: NE555
// datasheet (TI SLFS022, "Astable operation"): t_H = ln 2 (RA + RB) C,
// t_L = ln 2 RB C, so with RA 1 kΩ and C 1 µF, RB 10 kΩ -> 4.7 kΩ moves the
// period from ln 2 · 21 kΩ · 1 µF = 14.556 ms to ln 2 · 10.4 kΩ · 1 µF =
// 7.2087 ms (-50.48 %). The emulated figures may differ from these by the
// timer's count step (0.5 µs at 16 MHz / 8), far inside the 0.1 % asked here.
import { describe, expect, it } from "vitest";
import { signedIn } from "../../helpers/server";
import { makeUser, TEST_PASSWORD } from "../../helpers/users";
import { generate, makeRetrofit, setStageValue } from "./fixtures";

const LN2 = Math.log(2);

function visibleText(html: string): string {
  return html
    .replace(/<script[\s\S]*?<\/script>/g, " ")
    .replace(/<!--[\s\S]*?-->/g, "")
    .replace(/<[^>]+>/g, " ")
    .replace(/\s+/g, " ");
}

describe("compare page: both revisions' emulated outputs overlaid", { timeout: 180_000 }, () => {
  it("states the emulated period and high time old -> new for the target", async () => {
    const engineer = await makeUser("engineer");
    const reviewer = await signedIn((await makeUser("reviewer")).email, TEST_PASSWORD);
    const rf = await makeRetrofit({ rb: 10e3 });
    const r1 = await generate(rf.id, engineer.id);
    await setStageValue(rf.id, "rb", 4.7e3);
    const r2 = await generate(rf.id, engineer.id);
    const res = await reviewer.fetch(`/retrofits/${rf.id}/compare?a=${r1.id}&b=${r2.id}`);
    expect(res.status).toBe(200);
    const html = await res.text();
    const text = visibleText(html);
    const m = /Period ([\d.]+) ms → ([\d.]+) ms \(([-+\d.]+) %\); high time ([\d.]+) ms → ([\d.]+) ms/.exec(
      text,
    );
    expect(m, "overlay sentence on the page").not.toBeNull();
    const [p1, p2, pct, h1, h2] = m!.slice(1).map(Number);
    const rel = (x: number, want: number) => Math.abs(x - want) / want;
    expect(rel(p1, LN2 * 21e3 * 1e-6 * 1e3)).toBeLessThan(1e-3);
    expect(rel(p2, LN2 * 10.4e3 * 1e-6 * 1e3)).toBeLessThan(1e-3);
    expect(Math.abs(pct - -50.48)).toBeLessThan(0.05);
    expect(rel(h1, LN2 * 11e3 * 1e-6 * 1e3)).toBeLessThan(1e-3);
    expect(rel(h2, LN2 * 5.7e3 * 1e-6 * 1e3)).toBeLessThan(1e-3);
    // One overlay block for the one target (its chart is drawn in the browser).
    expect(html.match(/data-testid="emulation-overlay"/g)).toHaveLength(1);
    expect(html).toContain('data-folder="atmega328p"');
  });
});
