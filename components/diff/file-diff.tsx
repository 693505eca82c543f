"use client";

import { useState } from "react";
import { CommentForm } from "@/components/review/comment-form";
import type { DiffRow, FileStatus } from "@/lib/diff/types";

export type HighlightedRow = DiffRow & { html?: string };
export type LineComment = {
  id: number;
  body: string;
  line: number | null;
  author: string;
  createdAt: string;
};

const STATUS_TEXT: Record<FileStatus, string> = {
  added: "new file",
  removed: "removed",
  modified: "changed",
  unchanged: "unchanged",
};

const ROW_STYLE = { added: "bg-ok-soft", removed: "bg-hazard-soft", context: "" } as const;
const MARK = { added: "+", removed: "−", context: " " } as const;

/** One file's diff: changed lines with context, folds, comments of the newer revision inline. */
export function FileDiff(props: {
  path: string;
  status: FileStatus;
  added: number;
  removed: number;
  rows: HighlightedRow[];
  revisionId: number;
  canComment: boolean;
  comments: LineComment[];
}) {
  const [openLine, setOpenLine] = useState<number | null>(null);
  const byLine = new Map<number, LineComment[]>();
  for (const c of props.comments) if (c.line) byLine.set(c.line, [...(byLine.get(c.line) ?? []), c]);
  const fileComments = props.comments.filter((c) => !c.line);

  return (
    <section
      className="panel overflow-hidden p-0"
      aria-label={`Diff of ${props.path}`}
      data-file={props.path}
    >
      <header className="flex flex-wrap items-baseline gap-3 border-b border-paper-line bg-paper-sunk px-3 py-2">
        <h3 className="num text-sm font-semibold">{props.path}</h3>
        <span className="text-xs text-ink-muted">
          {STATUS_TEXT[props.status]} · <span className="num">+{props.added}</span>{" "}
          <span className="num">−{props.removed}</span>
        </span>
      </header>
      {fileComments.map((c) => (
        <Comment key={c.id} c={c} />
      ))}
      <div className="overflow-x-auto">
        <table className="w-full border-collapse font-mono text-xs leading-5">
          <tbody>
            {props.rows.map((row, i) => {
              if (row.kind === "fold") {
                return (
                  <tr key={i} className="bg-paper-sunk text-ink-muted" data-kind="fold">
                    <td colSpan={4} className="px-3 py-0.5">
                      ⋯ {row.count} unchanged {row.count === 1 ? "line" : "lines"} ({row.newFrom}–
                      {row.newFrom + row.count - 1})
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
                  <td className="w-12 select-none px-2 text-right text-ink-muted">{oldLine ?? ""}</td>
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
                      (newLine ?? "")
                    )}
                  </td>
                  <td className="w-4 select-none text-center" aria-hidden>
                    {MARK[row.kind]}
                  </td>
                  <td className="whitespace-pre pr-3">
                    <span className="sr-only">{row.kind === "context" ? "" : `${row.kind}: `}</span>
                    <code dangerouslySetInnerHTML={{ __html: row.html ?? "" }} />
                  </td>
                </tr>,
                ...notes.map((c) => (
                  <tr key={`${i}-c${c.id}`}>
                    <td colSpan={4} className="p-0">
                      <Comment c={c} />
                    </td>
                  </tr>
                )),
                openLine !== null && openLine === newLine ? (
                  <tr key={`${i}-form`}>
                    <td colSpan={4} className="bg-accent-soft px-3 py-2 font-sans">
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
    </section>
  );
}

function Comment({ c }: { c: LineComment }) {
  return (
    <div
      className="border-l-4 border-accent bg-paper-raised px-3 py-2 font-sans text-sm"
      data-testid="inline-comment"
    >
      <p className="text-xs text-ink-muted">
        {c.author} · {new Date(c.createdAt).toISOString().slice(0, 16).replace("T", " ")} UTC
        {c.line ? ` · line ${c.line}` : ""}
      </p>
      <p className="whitespace-pre-wrap">{c.body}</p>
    </div>
  );
}
