// The emulator's say on submitting: a revision whose built image differs from
// its plan in the emulator cannot be sent for checking (409); one with a target
// the emulator did not run ("not proven") can be sent only with a reason the
// author writes (422 naming unprovenReason without it); that reason is stored,
// audited and shown to the checker.
import { ApiError } from "@/lib/api/errors";
import type { BuildProgress } from "@/lib/revisions/build-state";
import { proofOf, verdictSentence, type RevisionEmulations } from "@/lib/revisions/emulations";

export const UNPROVEN_REASON_FIELD = "unprovenReason";

/** Returns the reason to store (null when every target is proven), or throws the refusal. */
export function proofGate(
  revision: { number: number; buildProgress: unknown; emulations: unknown },
  unprovenReason: string | undefined,
): string | null {
  const progress = (revision.buildProgress ?? {}) as BuildProgress;
  const emulations = (revision.emulations ?? {}) as RevisionEmulations;
  const folders = Object.entries(progress)
    .sort(([, a], [, b]) => a.index - b.index)
    .map(([f]) => f);
  const proof = proofOf(folders, emulations);
  if (proof.state === "differs") {
    const why = proof.folders.map((f) => `${f}: ${verdictSentence(emulations[f])}`).join(" ");
    throw new ApiError(
      "conflict",
      `r${revision.number} cannot be sent for checking: the emulated output differs from the plan. ${why} Fix the cause and generate a new revision.`,
    );
  }
  if (proof.state === "proven") return null;
  const reason = unprovenReason?.trim() ?? "";
  if (reason === "") {
    const message = `r${revision.number} is not proven in an emulator (${proof.reasons.join(" ")}). Say why it may be checked anyway in "${UNPROVEN_REASON_FIELD}".`;
    throw new ApiError("unprocessable", message, {
      [UNPROVEN_REASON_FIELD]:
        "Required: some targets were not proven in an emulator; say why it may be checked anyway.",
    });
  }
  return reason;
}
