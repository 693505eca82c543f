"use client";

import { useEffect, useState } from "react";
import { CommentForm } from "@/components/review/comment-form";
import { CommentThread } from "@/components/review/comment-thread";
import type { ThreadView } from "@/lib/review/thread-view";
import { fileAnchor } from "@/lib/diff/anchor";
import type { DiffRow, FileStatus } from "@/lib/diff/types";

/** A row with its highlighted HTML; a fold carries the HTML of the lines it hides so it can open. */
export type HighlightedRow = DiffRow & { html?: string; lines?: string[] };

const STATUS_TEXT: Record<FileStatus, string> = {
  added: "new file",
  removed: "removed",
  modified: "changed",
  unchanged: "unchanged",
};

// Our own presentation: one line-number column (the new revision's line, or
// the old one for a line that is gone), a word saying what happened to the
// line, and a coloured edge rather than a painted row.
const ROW_STYLE = {
  added: "border-l-4 border-ok",
  removed: "border-l-4 border-hazard text-ink-soft",
  context: "border-l-4 border-transparent",
} as const;
const TAG = { added: "new", removed: "gone", context: "" } as const;

/** One file's changes: changed lines with context, folds, comments of the newer revision inline.
 *  Closed by default so a six-device revision stays a short page; the file index opens it. */
export function FileDiff(props: {
  path: string;
  status: FileStatus;
  added: number;
  removed: number;
  rows: HighlightedRow[];
  revisionId: number;
  canComment: boolean;
  comments: ThreadView[];
}) {
  const [openLine, setOpenLine] = useState<number | null>(null);
  const [openFolds, setOpenFolds] = useState<ReadonlySet<number>>(new Set());
  const anchor = fileAnchor(props.path);
  const [open, setOpen] = useState(false);
  // A jump from the file index (or a shared link) opens the section it lands on.
  useEffect(() => {
    const follow = () => {
      if (window.location.hash !== `#${anchor}`) return;
      setOpen(true);
      // The browser scrolled while the section was still closed: near the end of
      // the page it could not reach the top. Scroll again once it is open.
      requestAnimationFrame(() =>
        requestAnimationFrame(() => document.getElementById(anchor)?.scrollIntoView({ block: "start" })),
      );
    };
    follow();
    window.addEventListener("hashchange", follow);
    return () => window.removeEventListener("hashchange", follow);
  }, [anchor]);
  // Threads on a line the view shows sit under it; the rest (file threads, lines inside a fold) on top.
  const shownLines = new Set<number>();
  for (const r of props.rows)
    if (r.kind === "fold") {
      if (openFolds.has(props.rows.indexOf(r)))
        for (let k = 0; k < r.count; k++) shownLines.add(r.newFrom + k);
    } else if (r.kind !== "removed") shownLines.add(r.newLine);
  const byLine = new Map<number, ThreadView[]>();
  for (const c of props.comments)
    if (c.line && shownLines.has(c.line)) byLine.set(c.line, [...(byLine.get(c.line) ?? []), c]);
  const fileComments = props.comments.filter((c) => !c.line || !shownLines.has(c.line));
  const thread = (c: ThreadView) => (
    <CommentThread key={c.id} thread={c} revisionId={props.revisionId} canComment={props.canComment} />
  );

  return (
    <section
      id={anchor}
      className="panel scroll-mt-4 overflow-hidden p-0"
      aria-label={`Changes in ${props.path}`}
      data-file={props.path}
    >
      <details open={open} onToggle={(e) => setOpen(e.currentTarget.open)}>
        <summary className="flex cursor-pointer flex-wrap items-baseline gap-3 border-b border-paper-line bg-paper-sunk px-3 py-2">
          <h3 className="num text-sm font-semibold">{props.path}</h3>
          <span className="text-xs text-ink-muted">
            {STATUS_TEXT[props.status]} · {props.added} new, {props.removed} gone
            {props.comments.length > 0 ? ` · ${props.comments.length} comment(s)` : ""}
          </span>
        </summary>
        {fileComments.map(thread)}
        <div className="overflow-x-auto">
          <table className="w-full border-collapse font-mono text-xs leading-5">
            <tbody>
              {props.rows
                .flatMap((folded, i): HighlightedRow[] =>
                  folded.kind === "fold" && openFolds.has(i)
                    ? Array.from({ length: folded.count }, (_, k) => ({
                        kind: "context" as const,
                        text: "",
                        oldLine: folded.oldFrom + k,
                        newLine: folded.newFrom + k,
                        html: folded.lines?.[k] ?? "",
                      }))
                    : [folded],
                )
                .map((row, i) => {
                  if (row.kind === "fold") {
                    const at = props.rows.indexOf(row);
                    return (
                      <tr key={`f${at}`} className="bg-paper-sunk text-ink-muted" data-kind="fold">
                        <td colSpan={3} className="px-3 py-0.5 font-sans">
                          {row.count} {row.count === 1 ? "line" : "lines"} as before ({row.newFrom}–
                          {row.newFrom + row.count - 1}){" "}
                          {row.lines && (
                            <button
                              type="button"
                              className="underline hover:text-accent"
                              onClick={() => setOpenFolds(new Set([...openFolds, at]))}
                            >
                              Show these lines
                            </button>
                          )}
                        </td>
                      </tr>
                    );
                  }
                  const newLine = row.kind === "removed" ? null : row.newLine;
                  const oldLine = row.kind === "added" ? null : row.oldLine;
                  const notes = newLine ? (byLine.get(newLine) ?? []) : [];
                  return [
                    <tr
                      key={i}
                      className={ROW_STYLE[row.kind]}
                      data-kind={row.kind}
                      data-new-line={newLine ?? undefined}
                    >
                      <td className="w-12 select-none px-2 text-right text-ink-muted">
                        {newLine && props.canComment ? (
                          <button
                            type="button"
                            className="hover:text-accent hover:underline"
                            aria-label={`Comment on line ${newLine} of ${props.path}`}
                            onClick={() => setOpenLine(openLine === newLine ? null : newLine)}
                          >
                            {newLine}
                          </button>
                        ) : (
                          (newLine ?? <span title="line number in the older revision">{oldLine}</span>)
                        )}
                      </td>
                      <td
                        className="w-10 select-none px-1 font-sans text-[10px] uppercase text-ink-muted"
                        aria-hidden
                      >
                        {TAG[row.kind]}
                      </td>
                      <td className="whitespace-pre pr-3">
                        <span className="sr-only">{row.kind === "context" ? "" : `${row.kind}: `}</span>
                        <code dangerouslySetInnerHTML={{ __html: row.html ?? "" }} />
                      </td>
                    </tr>,
                    ...notes.map((c) => (
                      <tr key={`${i}-c${c.id}`}>
                        <td colSpan={3} className="p-0">
                          {thread(c)}
                        </td>
                      </tr>
                    )),
                    openLine !== null && openLine === newLine ? (
                      <tr key={`${i}-form`}>
                        <td colSpan={3} className="bg-accent-soft px-3 py-2 font-sans">
                          <CommentForm
                            revisionId={props.revisionId}
                            filePath={props.path}
                            line={newLine}
                            autoFocus
                            onDone={() => setOpenLine(null)}
                          />
                        </td>
                      </tr>
                    ) : null,
                  ];
                })}
            </tbody>
          </table>
        </div>
      </details>
    </section>
  );
}
