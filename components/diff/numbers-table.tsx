import type { NumberChange } from "@/lib/diff/types";

/** The numbers that changed between two revisions, before and after, aligned. */
export function NumbersTable({ rows, a, b }: { rows: NumberChange[]; a: number; b: number }) {
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
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} data-key={r.key}>
              <td>{r.what}</td>
              <td className="num text-right text-ink-soft">{r.before}</td>
              <td className="num text-right font-semibold">{r.after}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
