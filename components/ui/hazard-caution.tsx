// The safety caution for retrofits on mains-powered boards or that fire a
// thyristor. A bordered block with an icon and words, never colour alone.
export function HazardCaution({
  mainsPowered,
  drivesThyristor,
}: {
  mainsPowered: boolean;
  drivesThyristor: boolean;
}) {
  if (!mainsPowered && !drivesThyristor) return null;
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
          <li>Isolate and lock out the supply before work; verify absence of voltage with a tested meter.</li>
          {drivesThyristor && (
            <li>
              Keep the gate drive isolated (pulse transformer or opto-driver) where the old stage had one;
              never tie the microcontroller ground to a mains-referenced cathode.
            </li>
          )}
          <li>Local electrical codes and licensed practice prevail over this page and the bundle.</li>
        </ul>
      </div>
    </aside>
  );
}
