import { hex } from "@/lib/bundle/format";
import { CommentRowButton } from "@/components/review/comment-row-button";
import type { RegisterTarget } from "@/lib/diff/registers";

const shown = (v: number | null) =>
  v === null ? "—" : `${v} (${hex(v, v > 0xffff ? 8 : v > 0xff ? 4 : 2)})`;

/**
 * Per device, each register the firmware writes: old value, new value and the
 * formula behind it. `anchorKeys`: the newer revision's comment anchors; a
 * register that is one of them gets a "Comment" button.
 */
export function RegisterTable({
  targets,
  a,
  b,
  anchorKeys,
}: {
  targets: RegisterTarget[];
  a: number;
  b: number;
  anchorKeys?: string[];
}) {
  if (targets.length === 0)
    return <p className="panel text-ink-soft">No target planned in either revision.</p>;
  const old = a === 0 ? "before" : `r${a}`;
  return (
    <div className="space-y-4">
      {targets.map((t) => {
        const changed = t.rows.filter((r) => r.changed).length;
        return (
          <div key={t.position} className="panel overflow-x-auto" data-registers={t.position}>
            <h3 className="mb-1 text-sm font-semibold">
              Target {t.position}: {t.deviceName}{" "}
              <span className="font-normal text-ink-muted">
                ·{" "}
                {changed === 0
                  ? "every register as before"
                  : `${changed} of ${t.rows.length} registers change`}
              </span>
            </h3>
            {t.note && <p className="mb-2 text-xs text-ink-muted">Note: {t.note}.</p>}
            <table className="table-dense" aria-label={`Registers of target ${t.position}`}>
              <thead>
                <tr>
                  <th scope="col">Register</th>
                  <th scope="col" className="text-right">
                    {old}
                  </th>
                  <th scope="col" className="text-right">
                    r{b}
                  </th>
                  <th scope="col">Where the value comes from</th>
                  {anchorKeys && (
                    <th scope="col">
                      <span className="sr-only">Comment</span>
                    </th>
                  )}
                </tr>
              </thead>
              <tbody>
                {t.rows.map((r) => (
                  <tr key={r.reg} data-reg={r.reg} data-changed={r.changed || undefined}>
                    <td className="num">{r.reg}</td>
                    <td className="num whitespace-nowrap text-right text-ink-soft">{shown(r.before)}</td>
                    <td className={`num whitespace-nowrap text-right ${r.changed ? "font-semibold" : ""}`}>
                      {shown(r.after)}
                    </td>
                    <td className="text-xs">
                      <code className="num">
                        {r.reg.replace(/ #\d+$/, "")} = {r.expr}
                      </code>
                      <span className="text-ink-soft"> · {r.why}</span>
                    </td>
                    {anchorKeys && (
                      <td className="text-right">
                        {anchorKeys.includes(`target${t.position}.register.${r.reg}`) && (
                          <CommentRowButton
                            anchorKey={`target${t.position}.register.${r.reg}`}
                            label={`target ${t.position} ${r.reg}`}
                          />
                        )}
                      </td>
                    )}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        );
      })}
    </div>
  );
}
