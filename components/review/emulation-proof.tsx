// Per target: the emulator's verdict on the built image in plain words
// ("Agrees ...", "Differs ...", "Not proven: <reason>"), the emulated pin
// output drawn under the planned waveform, the tool and the image sha256 it ran.
import { EmulationChart } from "@/components/charts/emulation-chart";
import { formatEng } from "@/lib/engine";
import { PROOF_WORDS, proofOf, verdictSentence, type RevisionEmulations } from "@/lib/revisions/emulations";

const TONE = {
  agrees: "border-ok text-ok",
  differs: "border-hazard text-hazard",
  "not-emulated": "border-ink-soft text-ink-soft",
} as const;

export function EmulationProof({
  folders,
  emulations,
  number,
  unprovenReason,
  headingId,
}: {
  /** the revision's target folders, in target order */
  folders: string[];
  emulations: RevisionEmulations;
  number: number;
  unprovenReason?: string | null;
  headingId: string;
}) {
  const proof = proofOf(folders, emulations);
  return (
    <section
      aria-labelledby={headingId}
      className="panel space-y-3"
      data-testid={`emulation-proof-r${number}`}
    >
      <h2 id={headingId} className="font-semibold">
        r{number} in the emulator: <span data-testid="proof-state">{PROOF_WORDS[proof.state]}</span>
      </h2>
      {unprovenReason && (
        <p className="text-sm" data-testid="unproven-reason">
          Sent for checking without full proof. The author&apos;s reason: {unprovenReason}
        </p>
      )}
      {folders.map((folder) => {
        const e = emulations[folder];
        const tone = TONE[e?.verdict ?? "not-emulated"];
        return (
          <div key={folder} className="space-y-1" data-testid="emulation-target">
            <h3 className="num text-sm font-semibold">{folder}/</h3>
            <p className={`border-l-4 pl-2 text-sm ${tone}`} data-testid="emulation-verdict">
              {verdictSentence(e)}
            </p>
            {e && (
              <p className="text-xs text-ink-soft">
                Plan on {e.planned.pin}: period {formatEng(e.planned.periodS, "s", 6)}, high{" "}
                {formatEng(e.planned.highS, "s", 6)}
                {e.tool && <> · {e.tool}</>}
                {e.emulatedS !== undefined && <> · {formatEng(e.emulatedS, "s")} emulated</>}
                {e.image && (
                  <>
                    {" "}
                    · ran <span className="num">{e.image.path}</span> sha256{" "}
                    <code className="num break-all">{e.image.sha256}</code>
                  </>
                )}
              </p>
            )}
            {e && (
              <EmulationChart
                planned={e.planned}
                edges={e.edges}
                label={
                  e.edges
                    ? `${folder}: emulated pin ${e.planned.pin} (solid) under the planned waveform (dashed), from its first rising edge`
                    : `${folder}: planned waveform only; the image was not run`
                }
              />
            )}
          </div>
        );
      })}
    </section>
  );
}
