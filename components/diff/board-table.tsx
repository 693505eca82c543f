import { CommentRowButton } from "@/components/review/comment-row-button";
import type { BoardTarget } from "@/lib/diff/board";

const VERDICT = { meets: "meets the tolerance", misses: "misses the tolerance" } as const;

/**
 * What the board does, old vs new, one small table per target; shown first on
 * the compare page. `anchorKeys`: the newer revision's comment anchors; a row
 * whose quantity is one of them gets a "Comment" button.
 */
export function BoardTable({
  targets,
  a,
  b,
  anchorKeys,
}: {
  targets: BoardTarget[];
  a: number;
  b: number;
  anchorKeys?: string[];
}) {
  if (targets.length === 0)
    return <p className="panel text-ink-soft">No target planned in either revision.</p>;
  const old = a === 0 ? "before" : `r${a}`;
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      {targets.map((t) => (
        <div key={t.position} className="panel overflow-x-auto" data-target={t.position}>
          <h3 className="mb-1 text-sm font-semibold">
            Target {t.position}: {t.deviceName}
          </h3>
          <p className="mb-2 text-xs text-ink-muted">
            {old}: {t.verdictBefore ? VERDICT[t.verdictBefore] : "no budget"} · r{b}:{" "}
            <span className={t.verdictAfter === "misses" ? "font-semibold text-hazard" : ""}>
              {t.verdictAfter ? VERDICT[t.verdictAfter] : "no budget"}
            </span>
          </p>
          <table className="table-dense" aria-label={`Board timing of target ${t.position}`}>
            <thead>
              <tr>
                <th scope="col">Quantity</th>
                <th scope="col" className="text-right">
                  {old}
                </th>
                <th scope="col" className="text-right">
                  r{b}
                </th>
                <th scope="col" className="text-right">
                  Change
                </th>
                {anchorKeys && (
                  <th scope="col">
                    <span className="sr-only">Comment</span>
                  </th>
                )}
              </tr>
            </thead>
            <tbody>
              {t.quantities.map((q) => (
                <tr key={q.key} data-key={q.key} data-changed={q.changed || undefined}>
                  <td>{q.what}</td>
                  <td className="num text-right text-ink-soft">{q.before}</td>
                  <td className={`num text-right ${q.changed ? "font-semibold" : ""}`}>{q.after}</td>
                  <td className="num text-right">{q.changed ? q.difference || "changed" : "same"}</td>
                  {anchorKeys && (
                    <td className="text-right">
                      {anchorKeys.includes(`target${t.position}.${q.key}`) && (
                        <CommentRowButton
                          anchorKey={`target${t.position}.${q.key}`}
                          label={`target ${t.position} ${q.what.toLowerCase()}`}
                        />
                      )}
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ))}
    </div>
  );
}
