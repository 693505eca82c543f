// Accessibility scan inside the browser page: axe-core's engine injected as a
// script, run against WCAG 2.x A and AA rules, keeping only the violations
// axe rates serious or critical (the ones the issue asks to bring to zero).
import axe from "axe-core";
import type { Page } from "playwright-core";

export type AxeFinding = { id: string; impact: string; help: string; targets: string[] };

export async function seriousViolations(page: Page): Promise<AxeFinding[]> {
  await page.addScriptTag({ content: axe.source });
  return page.evaluate(async () => {
    const w = window as unknown as { axe: typeof axe };
    const r = await w.axe.run(document, {
      runOnly: { type: "tag", values: ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"] },
    });
    return r.violations
      .filter((v) => v.impact === "serious" || v.impact === "critical")
      .map((v) => ({
        id: v.id,
        impact: v.impact ?? "",
        help: v.help,
        targets: v.nodes.map((n) => n.target.join(" ")),
      }));
  });
}
