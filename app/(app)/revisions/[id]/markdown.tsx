// Renders the generated Markdown (pin map, checklist, README) as HTML
// elements: headings, pipe tables, bullet lists and paragraphs, the subset the
// bundle templates write. Text goes through React, so nothing is injected.
import { Fragment, type ReactNode } from "react";

function unescape(s: string): string {
  return s.replace(/\\([\\`*_{}[\]()#+\-.!|])/g, "$1");
}

function inline(s: string): ReactNode {
  // `code` and **bold**; everything else is plain text.
  const parts = s.split(/(`[^`]+`|\*\*[^*]+\*\*)/g);
  return parts.map((p, i) => {
    if (p.startsWith("`") && p.endsWith("`")) return <code key={i}>{p.slice(1, -1)}</code>;
    if (p.startsWith("**") && p.endsWith("**")) return <strong key={i}>{unescape(p.slice(2, -2))}</strong>;
    return <Fragment key={i}>{unescape(p)}</Fragment>;
  });
}

function cells(line: string): string[] {
  const body = line.trim().replace(/^\|/, "").replace(/\|$/, "");
  return body.split(/(?<!\\)\|/).map((c) => c.trim());
}

export function Markdown({ source }: { source: string }) {
  const lines = source.split("\n");
  const out: ReactNode[] = [];
  let i = 0;
  while (i < lines.length) {
    const line = lines[i];
    const h = /^(#{1,4})\s+(.*)$/.exec(line);
    if (h) {
      const level = h[1].length;
      const cls = level === 1 ? "text-lg font-semibold" : "mt-3 font-semibold";
      const Tag = (level === 1 ? "h3" : "h4") as "h3";
      out.push(
        <Tag key={i} className={cls}>
          {inline(h[2])}
        </Tag>,
      );
      i++;
    } else if (line.trim().startsWith("|")) {
      const rows: string[] = [];
      while (i < lines.length && lines[i].trim().startsWith("|")) rows.push(lines[i++]);
      const [head, , ...body] = rows;
      out.push(
        // Focusable so keyboard users can scroll a wide table (axe scrollable-region-focusable).
        <div key={i} className="overflow-x-auto" tabIndex={0} role="region" aria-label="Table">
          <table className="table-dense my-2">
            <thead>
              <tr>
                {cells(head).map((c, k) => (
                  <th key={k}>{inline(c)}</th>
                ))}
              </tr>
            </thead>
            <tbody>
              {body.map((r, k) => (
                <tr key={k}>
                  {cells(r).map((c, m) => (
                    <td key={m} className="num">
                      {inline(c)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>,
      );
    } else if (/^\s*[-*]\s+/.test(line)) {
      const items: string[] = [];
      while (i < lines.length && /^\s*[-*]\s+/.test(lines[i]))
        items.push(lines[i++].replace(/^\s*[-*]\s+/, ""));
      out.push(
        <ul key={i} className="my-2 list-disc space-y-1 pl-5">
          {items.map((t, k) => (
            <li key={k}>{inline(t)}</li>
          ))}
        </ul>,
      );
    } else if (line.trim() === "") {
      i++;
    } else {
      const para: string[] = [];
      while (i < lines.length && lines[i].trim() !== "" && !/^(#|\||\s*[-*]\s)/.test(lines[i]))
        para.push(lines[i++]);
      out.push(
        <p key={i} className="my-2">
          {inline(para.join(" "))}
        </p>,
      );
    }
  }
  return <div className="text-sm">{out}</div>;
}
