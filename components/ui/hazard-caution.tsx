// The safety caution for retrofits on mains-powered boards or that fire a
// thyristor: a bordered block with an icon and words, never colour alone. The
// lines are the same ones the bundle prints in its README and checklists.
import { cautionLines } from "@/lib/bundle/safety";

export function HazardCaution({
  mainsPowered,
  drivesThyristor,
}: {
  mainsPowered: boolean;
  drivesThyristor: boolean;
}) {
  const lines = cautionLines({ name: "", mainsPowered, drivesThyristor });
  if (lines.length === 0) return null;
  const hazards = [mainsPowered && "mains-powered board", drivesThyristor && "fires a thyristor gate"].filter(
    Boolean,
  );
  return (
    <aside
      role="note"
      aria-label="Safety caution"
      className="flex gap-3 rounded border-2 border-hazard bg-hazard-soft p-3 text-sm text-ink"
    >
      <svg aria-hidden="true" viewBox="0 0 24 24" className="mt-0.5 h-5 w-5 shrink-0 fill-hazard">
        <path d="M12 2 1 21h22L12 2zm0 6 7.5 11h-15L12 8zm-1 3v4h2v-4h-2zm0 5v2h2v-2h-2z" />
      </svg>
      <div>
        <p className="font-semibold">Caution: {hazards.join(" and ")}</p>
        <ul className="mt-1 list-disc pl-5">
          {lines.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </div>
    </aside>
  );
}
