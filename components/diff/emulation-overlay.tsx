// Compare page: per target folder both revisions built, their emulated pin
// outputs overlaid on one axis (older dashed, newer solid, each from its own
// first rising edge), with the emulated period and high time old -> new in
// words. Targets the older revision did not have, or that did not run on a
// side, say so instead of drawing a guess.
import { EmulationOverlayChart } from "@/components/charts/emulation-overlay-chart";
import { formatEng } from "@/lib/engine";
import type { RevisionEmulations, TargetEmulation } from "@/lib/revisions/emulations";

type Side = { number: number; emulations: RevisionEmulations };

/** Drawn length: three of the longer emulated (else planned) period. */
function spanOf(a: TargetEmulation, b: TargetEmulation): number {
  const p = (e: TargetEmulation) => e.periodS ?? e.planned.periodS;
  return 3 * Math.max(p(a), p(b));
}

function change(what: string, a: number | undefined, b: number | undefined): string | null {
  if (a === undefined || b === undefined) return null;
  if (a === b) return `${what} ${formatEng(b, "s", 6)} on both`;
  const pct = ((b - a) / a) * 100;
  return `${what} ${formatEng(a, "s", 6)} → ${formatEng(b, "s", 6)} (${pct > 0 ? "+" : ""}${Number(pct.toPrecision(3))} %)`;
}

export function EmulationOverlay({
  folders,
  older,
  newer,
  folded,
}: {
  /** the newer revision's target folders, in target order */
  folders: string[];
  older: Side;
  newer: Side;
  folded: boolean;
}) {
  const rows = folders.map((folder) => {
    const a = older.emulations[folder];
    const b = newer.emulations[folder];
    return { folder, a, b };
  });
  const body = rows.map(({ folder, a, b }) => {
    const both = a?.edges?.length && b?.edges?.length;
    const words = both
      ? [
          change("Period", a.periodS, b.periodS),
          change("high time", a.highS, b.highS),
          // triggered and zero-cross targets: delay from the input edge and pulse width
          change("Delay from the input edge", a.delayS, b.delayS),
          change("pulse", a.widthS, b.widthS),
        ]
          .filter(Boolean)
          .join("; ") || "Both ran; no timing figure was stored to compare."
      : !a
        ? `r${older.number} had no emulated ${folder}/ target to overlay.`
        : `Not overlaid: ${!a.edges?.length ? `r${older.number}` : `r${newer.number}`} has no emulated pin edges for ${folder}/.`;
    return (
      <div key={folder} className="space-y-1" data-testid="emulation-overlay" data-folder={folder}>
        <h3 className="num text-sm font-semibold">{folder}/</h3>
        <p className="text-sm" data-testid="overlay-words">
          {words}
        </p>
        {both ? (
          <EmulationOverlayChart
            older={a.edges}
            newer={b.edges}
            spanS={spanOf(a, b)}
            names={[`r${older.number}`, `r${newer.number}`]}
            label={`${folder}: emulated pin ${b.planned.pin}, r${older.number} (dashed, above) and r${newer.number} (solid), each from its first rising edge`}
          />
        ) : null}
      </div>
    );
  });
  if (!folded) return <div className="panel space-y-3">{body}</div>;
  return (
    <details className="panel space-y-3">
      <summary className="cursor-pointer text-sm text-ink-soft">
        Both revisions&apos; pin output overlaid, for each of the {folders.length} targets
      </summary>
      {body}
    </details>
  );
}
