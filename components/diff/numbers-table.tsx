import { CommentRowButton } from "@/components/review/comment-row-button";
import type { NumberChange } from "@/lib/diff/types";
import { anchorKeyOfNumber } from "@/lib/review/anchors";

/**
 * The numbers that changed between two revisions, before and after, aligned.
 * With `anchorKeys` (the viewer may comment) a row that is a quantity or
 * register anchor gets a Comment button (inside a CommentAnchorProvider).
 */
export function NumbersTable({
  rows,
  a,
  b,
  anchorKeys,
}: {
  rows: NumberChange[];
  a: number;
  b: number;
  anchorKeys?: readonly string[];
}) {
  if (rows.length === 0) {
    return (
      <p className="panel text-ink-soft">
        No number changed between {a === 0 ? "nothing" : `r${a}`} and r{b}: same stage values, timing,
        registers and pins.
      </p>
    );
  }
  return (
    <div className="overflow-x-auto">
      <table className="table-dense" aria-label="Numbers that changed">
        <thead>
          <tr>
            <th scope="col">What</th>
            <th scope="col" className="text-right">
              {a === 0 ? "before" : `r${a}`}
            </th>
            <th scope="col" className="text-right">
              r{b}
            </th>
            {anchorKeys && (
              <th scope="col">
                <span className="sr-only">Comment</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => {
            const anchor = anchorKeys ? anchorKeyOfNumber(r.key, anchorKeys) : null;
            return (
              <tr key={r.key} data-key={r.key}>
                <td>{r.what}</td>
                <td className="num text-right text-ink-soft">{r.before}</td>
                <td className="num text-right font-semibold">{r.after}</td>
                {anchorKeys && (
                  <td className="text-right">
                    {anchor && (
                      <CommentRowButton anchorKey={anchor} label={r.what.replace(/^Target/, "target")} />
                    )}
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
