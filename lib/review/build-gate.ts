// Only a revision whose every target built can be sent for checking: a reviewer
// approves bytes, and a building or failed revision has none.
import { ApiError } from "@/lib/api/errors";
import type { BuildState } from "@/lib/revisions/build-state";

export function buildRefusal(revision: { number: number; buildState: BuildState }): ApiError | null {
  if (revision.buildState === "building")
    return new ApiError(
      "conflict",
      `r${revision.number} is still being built; submit it once every target has built (its page shows the progress).`,
    );
  if (revision.buildState === "failed")
    return new ApiError(
      "conflict",
      `r${revision.number} did not build and cannot be submitted; fix the reason on its page and generate a new revision.`,
    );
  return null;
}
