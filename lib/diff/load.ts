// Loading two revisions of one retrofit for comparison, with the read rule of
// lib/revisions/access.ts applied to both, and the default pair for a retrofit.
import "server-only";
import { asc, desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits, revisionFiles, revisions } from "@/db/schema";
import { ApiError, notFound } from "@/lib/api/errors";
import type { AuthUser } from "@/lib/auth/guard";
import { assertCanReadRevision } from "@/lib/revisions/access";
import { compareSnapshots } from "./index";
import type { BuildState } from "@/lib/revisions/build-state";
import { NOTHING_ID, unbuiltFilesSentence, unbuiltOf } from "./unbuilt";
import type { RevisionComparison, RevisionRef, RevisionSnapshot, UnbuiltSide } from "./types";

/** A revision as the comparison reads it, with its build state: files exist only once it is built. */
export type Loaded = RevisionRef &
  RevisionSnapshot & {
    retrofitId: number;
    buildState: BuildState;
    buildError: string | null;
    buildProgress: unknown;
  };

async function loadOne(id: number): Promise<Loaded & { site: string }> {
  const [row] = await db
    .select({
      id: revisions.id,
      number: revisions.number,
      state: revisions.state,
      retrofitId: revisions.retrofitId,
      spec: revisions.spec,
      analysis: revisions.analysis,
      plans: revisions.plans,
      buildState: revisions.buildState,
      buildError: revisions.buildError,
      buildProgress: revisions.buildProgress,
      site: retrofits.site,
    })
    .from(revisions)
    .innerJoin(retrofits, eq(retrofits.id, revisions.retrofitId))
    .where(eq(revisions.id, id));
  // The same words as a revision outside the read rule (no existence oracle).
  if (!row) throw notFound("Revision");
  const files = await db
    .select({ path: revisionFiles.path, content: revisionFiles.content })
    .from(revisionFiles)
    .where(eq(revisionFiles.revisionId, id))
    .orderBy(asc(revisionFiles.path));
  return { ...row, files };
}

/** The "before" side of a first revision: nothing, so every file shows as added. */
export { NOTHING_ID };
const nothing = (retrofitId: number): Loaded & { site: string } => ({
  id: NOTHING_ID,
  number: 0,
  state: "prepared",
  retrofitId,
  spec: {},
  analysis: {},
  plans: [],
  files: [],
  buildState: "ready",
  buildError: null,
  buildProgress: {},
  site: "",
});

/** Both revisions, checked: same retrofit, readable by `user`. `aId` 0 = nothing before. */
export async function loadPair(user: AuthUser, aId: number, bId: number): Promise<{ a: Loaded; b: Loaded }> {
  const b = await loadOne(bId);
  const a = aId === NOTHING_ID ? nothing(b.retrofitId) : await loadOne(aId);
  if (aId === NOTHING_ID) {
    assertCanReadRevision(user, b, { site: b.site });
    return { a, b };
  }
  assertCanReadRevision(user, a, { site: a.site });
  assertCanReadRevision(user, b, { site: b.site });
  if (a.retrofitId !== b.retrofitId) {
    throw new ApiError("unprocessable", "Both revisions must belong to the same retrofit.", {
      b: "Another retrofit.",
    });
  }
  return { a, b };
}

/** The sides of a pair whose build is not done (the "nothing" side counts as built). */
export function unbuiltSides(a: Loaded, b: Loaded): UnbuiltSide[] {
  return unbuiltOf([a, b]).map((r) => ({
    id: r.id,
    number: r.number,
    buildState: r.buildState,
    buildError: r.buildError,
  }));
}

/** Plain words for why the files of a pair cannot be compared yet. */
export function unbuiltMessage(sides: UnbuiltSide[]): string {
  return `${unbuiltFilesSentence(sides)} The numbers compare from the plans.`;
}

/**
 * The comparison the API answers. While a side is unbuilt its files do not
 * exist yet, so the file part is empty and `unbuilt` says why (instead of
 * listing every file of the other side as gone or new).
 */
export async function compareRevisions(
  user: AuthUser,
  aId: number,
  bId: number,
): Promise<RevisionComparison> {
  const { a, b } = await loadPair(user, aId, bId);
  const unbuilt = unbuiltSides(a, b);
  const cmp = compareSnapshots(a.retrofitId, a, b);
  return unbuilt.length === 0 ? { ...cmp, unbuilt } : { ...cmp, files: [], unbuilt };
}

export type RevisionChoice = { id: number; number: number; state: string; supersededAt: Date | null };

export async function revisionsOf(retrofitId: number): Promise<RevisionChoice[]> {
  return db
    .select({
      id: revisions.id,
      number: revisions.number,
      state: revisions.state,
      supersededAt: revisions.supersededAt,
    })
    .from(revisions)
    .where(eq(revisions.retrofitId, retrofitId))
    .orderBy(desc(revisions.number));
}

/** Default pair: the newest revision in review (else the newest) against the
 *  last approved revision before it (else the one just before it, else nothing). */
export async function defaultPair(
  retrofitId: number,
  bId?: number,
): Promise<{ a: number; b: number } | null> {
  const all = await revisionsOf(retrofitId);
  const b =
    (bId ? all.find((r) => r.id === bId) : undefined) ??
    all.find((r) => r.state === "awaiting_check") ??
    all[0];
  if (!b) return null;
  const older = all.filter((r) => r.number < b.number);
  const a = older.find((r) => r.state === "released") ?? older[0];
  return { a: a?.id ?? NOTHING_ID, b: b.id };
}
