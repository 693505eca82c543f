// Syntax colouring of generated files with shiki: ONE highlighter per server
// process, shared by the revision page and the compare page. The high-contrast
// light theme keeps every token at WCAG AA on the paper background.
import "server-only";
import { createHighlighter, type Highlighter } from "shiki";

const THEME = "github-light-high-contrast";
const LANGS = ["c", "make", "json", "markdown", "csv", "asm"] as const;
export type Lang = (typeof LANGS)[number] | "text";

const g = globalThis as unknown as { clockgraftHighlighter?: Promise<Highlighter> };
const highlighter = () =>
  (g.clockgraftHighlighter ??= createHighlighter({ themes: [THEME], langs: [...LANGS] }));

export function languageOf(path: string): Lang {
  const name = path.split("/").pop() ?? path;
  if (name === "Makefile" || name.endsWith(".mk")) return "make";
  const ext = name.includes(".") ? name.split(".").pop()! : "";
  const byExt: Record<string, Lang> = {
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

const escape = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/** A whole file as shiki's HTML (a <pre> with escaped, coloured spans). */
export async function highlightHtml(path: string, content: string): Promise<string> {
  const h = await highlighter();
  return h.codeToHtml(content, { lang: languageOf(path), theme: THEME });
}

/**
 * HTML per line (index 0 = line 1); only <span style="color"> around escaped
 * text. Whole files are tokenised, not single lines, so comments and strings
 * that span lines keep their colour.
 */
export async function highlightLines(path: string, content: string): Promise<string[]> {
  const lang = languageOf(path);
  const lines = content.endsWith("\n") ? content.slice(0, -1) : content;
  if (lang === "text" || content.length > 400_000) return lines.split("\n").map(escape);
  const h = await highlighter();
  const tokens = h.codeToTokensBase(lines, { lang, theme: THEME });
  return tokens.map((line) =>
    line
      .map((t) =>
        t.color ? `<span style="color:${t.color}">${escape(t.content)}</span>` : escape(t.content),
      )
      .join(""),
  );
}
