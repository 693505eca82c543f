// The checklist lines of one field check: expected, limits and where they come
// from, measured, verdict (derived lines are information only).
// Pass/fail is spelled out, not shown by colour alone, and comes right after
// the line's name so it stays on screen at phone width; limits wrap instead.
import { formatEng } from "@/lib/engine";
import type { CheckLine } from "@/lib/field/shapes";

function fmt(l: CheckLine, x: number): string {
  return l.unit === "" ? formatEng(x, "%", 5) : formatEng(x, l.unit, 6);
}

export function CheckLines({ lines }: { lines: CheckLine[] }) {
  return (
    // Focusable so that keyboard users can scroll it if a long label still overflows.
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Checklist results">
      <table className="table-dense">
        <thead>
          <tr>
            <th scope="col">Line</th>
            <th scope="col">Result</th>
            <th scope="col">Measured</th>
            <th scope="col">Limits</th>
          </tr>
        </thead>
        <tbody>
          {lines.map((l) => (
            <tr key={`${l.target}-${l.id}`}>
              <th scope="row" className="font-normal">
                {l.label}
              </th>
              {l.derived ? (
                // Derived from the two measured times: shown for reading, never a second failure.
                <td className="text-ink-soft" data-testid="line-result">
                  Information
                </td>
              ) : (
                <td
                  className={`font-semibold ${l.pass ? "text-ok" : "text-hazard"}`}
                  data-testid="line-result"
                >
                  {l.pass ? "Pass" : "Fail"}
                </td>
              )}
              <td className="num">{fmt(l, l.measured)}</td>
              <td className="num text-ink-soft">
                <span className="whitespace-nowrap">{fmt(l, l.min)} …</span>{" "}
                <span className="whitespace-nowrap">{fmt(l, l.max)}</span>
                {l.source && (
                  <span className="block text-xs" data-testid="line-source">
                    {l.derived ? l.source : `limit from ${l.source}`}
                  </span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
