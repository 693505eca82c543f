// One generated file: path, sha256 and its highlighted text.
import { highlightHtml } from "@/lib/highlight/shiki";

export async function FileView({ path, content, sha256 }: { path: string; content: string; sha256: string }) {
  const html = await highlightHtml(path, content);
  const anchor = `file-${path.replace(/[^A-Za-z0-9]+/g, "-")}`;
  return (
    <details id={anchor} className="rounded border border-paper-line bg-paper-raised">
      <summary className="cursor-pointer px-3 py-2 text-sm">
        <span className="num font-medium">{path}</span>{" "}
        <span className="num text-xs text-ink-muted" title={sha256}>
          sha256 {sha256.slice(0, 12)}…
        </span>
      </summary>
      <div
        className="overflow-x-auto border-t border-paper-line text-xs [&_pre]:p-3 [&_pre]:font-mono"
        // shiki escapes the file text; the HTML is its markup only.
        dangerouslySetInnerHTML={{ __html: html }}
      />
    </details>
  );
}
