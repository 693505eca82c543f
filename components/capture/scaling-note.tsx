// One line saying how the measured column's numbers became volts: the unit
// and where it came from, a header scale factor and offset, the probe factor.
import { formatEng } from "@/lib/engine";
import type { MeasurementSummary } from "@/lib/field/shapes";

export function ScalingNote({ m }: { m: MeasurementSummary }) {
  const s = m.scaling;
  if (!s) return null;
  const column = m.columns[m.measuredColumn]?.name ?? `column ${m.measuredColumn + 1}`;
  const parts = [
    `Channel ${s.voltageColumn + 1} of ${s.voltageColumns} ("${column}")`,
    s.unitFrom === "none"
      ? "no unit given: read as volts"
      : `read in ${s.unit} (${s.unitFrom === "header" ? "from a header line" : "from the column heading"})`,
  ];
  if (s.scale !== 1) parts.push(`× ${s.scale} (header scale factor)`);
  if (s.offsetV !== 0)
    parts.push(`${s.offsetV > 0 ? "+" : "−"} ${formatEng(Math.abs(s.offsetV), "V", 4)} (header offset)`);
  parts.push(s.probe === 1 ? "no probe factor applied" : `× ${s.probe} probe factor`);
  if (s.headerProbe !== null) parts.push(`the file says the scope applied a ${s.headerProbe}x probe`);
  return (
    <p className="text-sm text-ink-soft" data-testid="scaling-note">
      {parts.join(" · ")}
    </p>
  );
}
