// Handlebars set-up for the generated files. Templates are read from
// templates/ under the working directory at run time and compiled once.
// noEscape: the output is C, Makefiles and Markdown, not HTML; user text is
// made safe by the cc/md/csv helpers, which every template must use for it.
import Handlebars from "handlebars";
import { readFileSync } from "node:fs";
import path from "node:path";
import { eng, engAscii, hex, percent, ppm } from "./format";
import { cCommentText, csvField, markdownText } from "./sanitize";

const hb = Handlebars.create();

hb.registerHelper("hex", (v: number, w: unknown) => hex(v, typeof w === "number" ? w : 2));
hb.registerHelper("eng", (v: number, unit: string) => eng(v, unit));
hb.registerHelper("engA", (v: number, unit: string) => engAscii(v, unit));
hb.registerHelper("ppm", (v: number) => ppm(v));
hb.registerHelper("pct", (v: number) => percent(v));
hb.registerHelper("cc", (v: unknown) => cCommentText(String(v ?? "")));
hb.registerHelper("md", (v: unknown) => markdownText(String(v ?? "")));
hb.registerHelper("csv", (v: unknown) => csvField(String(v ?? "")));
hb.registerHelper("eq", (a: unknown, b: unknown) => a === b);
hb.registerHelper("gt", (a: number, b: number) => a > b);
hb.registerHelper("upper", (v: string) => String(v).toUpperCase());
hb.registerHelper("add", (a: number, b: number) => a + b);

const cache = new Map<string, HandlebarsTemplateDelegate>();

/** `{{> [device/file.hbs]}}` includes templates/device/file.hbs, so a feature's code
 * lives in its own file and the main template only holds the include line. */
function registerPartials(source: string): void {
  for (const m of source.matchAll(/\{\{>\s*\[([\w./-]+\.hbs)\]/g)) {
    const rel = m[1];
    if (rel.includes("..")) throw new Error(`template include outside templates/: ${rel}`);
    const text = readFileSync(path.join(templatesRoot(), rel), "utf8");
    hb.registerPartial(rel, text);
    registerPartials(text);
  }
}

export function templatesRoot(): string {
  return path.join(process.cwd(), "templates");
}

function compiled(rel: string): HandlebarsTemplateDelegate {
  let t = cache.get(rel);
  if (!t) {
    const file = path.join(templatesRoot(), rel);
    const source = readFileSync(file, "utf8");
    registerPartials(source);
    t = hb.compile(source, { noEscape: true, strict: true });
    cache.set(rel, t);
  }
  return t;
}

/** Render templates/<rel> with the context; output always ends in one newline. */
export function render(rel: string, context: object): string {
  const text = compiled(rel)(context)
    .replace(/[ \t]+$/gm, "")
    .replace(/\n{3,}/g, "\n\n");
  return text.replace(/\n*$/, "\n");
}

/** Forget compiled templates (tests that edit templates). */
export function clearTemplateCache(): void {
  cache.clear();
  for (const name of Object.keys(hb.partials)) hb.unregisterPartial(name);
}
