// The checklist lines of one field check: expected, limits, measured, verdict.
// Pass/fail is spelled out, not shown by colour alone.
import { formatEng } from "@/lib/engine";
import type { CheckLine } from "@/lib/field/shapes";

function fmt(l: CheckLine, x: number): string {
  return l.unit === "" ? formatEng(x, "%", 5) : formatEng(x, l.unit, 6);
}

export function CheckLines({ lines }: { lines: CheckLine[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="table-dense">
        <thead>
          <tr>
            <th scope="col">Line</th>
            <th scope="col">Measured</th>
            <th scope="col">Limits</th>
            <th scope="col">Result</th>
          </tr>
        </thead>
        <tbody>
          {lines.map((l) => (
            <tr key={`${l.target}-${l.id}`}>
              <th scope="row" className="font-normal">
                {l.label}
              </th>
              <td className="num whitespace-nowrap">{fmt(l, l.measured)}</td>
              <td className="num whitespace-nowrap text-ink-soft">
                {fmt(l, l.min)} … {fmt(l, l.max)}
              </td>
              <td className={`font-semibold ${l.pass ? "text-ok" : "text-hazard"}`}>
                {l.pass ? "Pass" : "Fail"}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
