// Syntax highlighting of generated files with shiki, one highlighter per
// server process. Output is shiki's escaped HTML.
import "server-only";
import { createHighlighter, type Highlighter } from "shiki";

const LANGS = ["c", "make", "json", "markdown", "csv", "asm"] as const;
const THEME = "github-light";
const g = globalThis as unknown as { clockgraftShiki?: Promise<Highlighter> };

function highlighter(): Promise<Highlighter> {
  g.clockgraftShiki ??= createHighlighter({ themes: [THEME], langs: [...LANGS] });
  return g.clockgraftShiki;
}

export function languageOf(path: string): string {
  const name = path.split("/").pop() ?? path;
  if (name === "Makefile") return "make";
  const ext = name.includes(".") ? name.split(".").pop()! : "";
  const byExt: Record<string, string> = {
    c: "c",
    h: "c",
    json: "json",
    md: "markdown",
    csv: "csv",
    s: "asm",
    S: "asm",
  };
  return byExt[ext] ?? "text";
}

export async function highlight(path: string, content: string): Promise<string> {
  const h = await highlighter();
  return h.codeToHtml(content, { lang: languageOf(path), theme: THEME });
}
