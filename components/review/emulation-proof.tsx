// Per target: the emulator's verdict on the built image in plain words
// ("Agrees ...", "Differs ...", "Not proven: <reason>"), the emulated pin
// output drawn under the planned waveform, the tool and the image sha256 it ran.
// A triggered or zero-cross run also names the driven input and the measured
// delay and pulse; its plan is drawn as one pulse per driven input edge.
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
  folded = false,
}: {
  /** the revision's target folders, in target order */
  folders: string[];
  emulations: RevisionEmulations;
  number: number;
  unprovenReason?: string | null;
  headingId: string;
  /** Many targets (the compare page of a six-device revision): the per-target part starts folded, the verdict stays in the heading. */
  folded?: boolean;
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
      <Fold folded={folded} count={folders.length}>
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
              {e?.trigger && (
                <p className="text-xs text-ink-soft" data-testid="emulation-trigger">
                  Input {e.trigger.input} driven with {e.trigger.edge === "both" ? "" : `${e.trigger.edge} `}
                  edges every {formatEng(e.trigger.spacingS, "s", 6)}
                  {e.delayS !== undefined && <> · measured delay {formatEng(e.delayS, "s", 6)}</>}
                  {e.widthS !== undefined && <> · pulse {formatEng(e.widthS, "s", 6)}</>}
                </p>
              )}
              {e && (
                <EmulationChart
                  planned={e.trigger ? { ...e.planned, periodS: e.trigger.spacingS } : e.planned}
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
      </Fold>
    </section>
  );
}

function Fold({ folded, count, children }: { folded: boolean; count: number; children: React.ReactNode }) {
  if (!folded) return <>{children}</>;
  return (
    <details className="space-y-3">
      <summary className="cursor-pointer text-sm text-ink-soft">
        Each of the {count} targets: verdict, plan and pin output
      </summary>
      {children}
    </details>
  );
}
