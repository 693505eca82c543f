// What a revision stores per target from the emulator run of its built image
// (revisions.emulations, one entry per bundle folder), and the plain words the
// pages and the submit rule use. Shared by the server and the browser (no
// server imports): "agrees", "differs by ...", "not proven: <reason>".
import type { EmulationResult } from "@/lib/firmware/emulate/types";

export interface TargetEmulation extends EmulationResult {
  /** 0-based position of the target in the revision */
  index: number;
  device: string;
  /** What the pin should do (pin-high time: an active-low output is high for the rest of the period). */
  planned: { periodS: number; highS: number; pin: string };
  toleranceS: { period: number; high: number };
  /** The image file the emulator ran and its sha256 (the bytes the approval covers). */
  image: { path: string; sha256: string } | null;
}

/** revisions.emulations: bundle folder -> TargetEmulation; {} before emulation ran. */
export type RevisionEmulations = Record<string, TargetEmulation>;

export type Proof =
  | { state: "proven" }
  | { state: "differs"; folders: string[] }
  | { state: "not-proven"; folders: string[]; reasons: string[] };

/** Sentence for one target: "Agrees ..." / "Differs ..." / "Not proven: <reason>". */
export function verdictSentence(e: Pick<EmulationResult, "verdict" | "reason"> | undefined): string {
  if (!e) return "Not proven: no emulator run was recorded for this target (built before emulation ran).";
  if (e.verdict === "not-emulated") return `Not proven: ${e.reason}`;
  return e.reason;
}

/** Whether every target of the revision (its build folders) agreed in the emulator. */
export function proofOf(folders: string[], emulations: RevisionEmulations): Proof {
  const differs = folders.filter((f) => emulations[f]?.verdict === "differs");
  if (differs.length > 0) return { state: "differs", folders: differs };
  const unproven = folders.filter((f) => emulations[f]?.verdict !== "agrees");
  if (unproven.length > 0)
    return {
      state: "not-proven",
      folders: unproven,
      reasons: unproven.map((f) => `${f}: ${verdictSentence(emulations[f])}`),
    };
  return { state: "proven" };
}

export const PROOF_WORDS: Record<Proof["state"], string> = {
  proven: "Proven in the emulator",
  differs: "Emulated output differs from the plan",
  "not-proven": "Not proven",
};
