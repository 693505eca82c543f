// Words and shapes of a revision's build: the revision row exists from the
// moment "generate" is pressed (state building, its number taken), and the
// worker fills in files, images and bundle, or records why it could not.
// Shared by the server, the JSON route and the browser (no server imports).

export const BUILD_STATES = ["building", "ready", "failed"] as const;
export type BuildState = (typeof BUILD_STATES)[number];

/** Steps of one target, in order; "failed" can follow any of them. */
export const BUILD_STEPS = ["queued", "compiling", "compiled", "emulating", "done", "failed"] as const;
export type BuildStep = (typeof BUILD_STEPS)[number];

export interface TargetProgress {
  /** 0-based position of the target in the revision (the form's targets.N) */
  index: number;
  device: string;
  step: BuildStep;
  /** why the step failed (compiler's first message, missing tool) */
  reason?: string;
}

/** build_progress: one entry per bundle folder. */
export type BuildProgress = Record<string, TargetProgress>;

export const BUILD_STATE_WORDS: Record<BuildState, string> = {
  building: "Building",
  ready: "Built",
  failed: "Build failed",
};

export const BUILD_STEP_WORDS: Record<BuildStep, string> = {
  queued: "waiting for a worker",
  compiling: "compiling",
  compiled: "compiled",
  emulating: "running in the emulator",
  done: "done",
  failed: "failed",
};

/** The build status a page or script polls (GET /api/v1/revisions/:id/build). */
export interface BuildStatus {
  id: number;
  number: number;
  buildState: BuildState;
  buildError: string | null;
  /** targets in revision order */
  targets: ({ folder: string } & TargetProgress)[];
}

export function progressList(progress: BuildProgress): BuildStatus["targets"] {
  return Object.entries(progress)
    .map(([folder, p]) => ({ folder, ...p }))
    .sort((a, b) => a.index - b.index);
}
