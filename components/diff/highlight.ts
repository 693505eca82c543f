// Server-side syntax colouring of whole files with shiki, returned as one HTML
// string per line so a diff row can take its line from either side. Whole
// files are tokenised (not single lines) so comments and strings that span
// lines keep their colour. The high-contrast light theme keeps every token
// at WCAG AA on the paper background.
import "server-only";
import { createHighlighter, type Highlighter } from "shiki";

const THEME = "github-light-high-contrast";
const LANGS = ["c", "make", "markdown", "json", "csv"] as const;
type Lang = (typeof LANGS)[number] | "text";

const g = globalThis as unknown as { clockgraftShiki?: Promise<Highlighter> };
const highlighter = () => (g.clockgraftShiki ??= createHighlighter({ themes: [THEME], langs: [...LANGS] }));

export function langOf(path: string): Lang {
  const name = path.split("/").pop() ?? path;
  if (/\.(c|h)$/.test(name)) return "c";
  if (name === "Makefile" || name.endsWith(".mk")) return "make";
  if (name.endsWith(".md")) return "markdown";
  if (name.endsWith(".json")) return "json";
  if (name.endsWith(".csv")) return "csv";
  return "text";
}

const escape = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/** HTML per line (index 0 = line 1); only <span style="color"> from escaped text. */
export async function highlightLines(path: string, content: string): Promise<string[]> {
  const lang = langOf(path);
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
