// Which sides of a compared pair have no built files yet, and the plain words
// for it: shared by the compare page, its build notice and the diff API.

/** Revision id standing for "nothing" (comparing the first revision against an empty start). */
export const NOTHING_ID = 0;

type Side = { id: number; number: number; buildState: string };

/** A side whose build is not done: its state narrowed to exclude "ready". */
export type Unbuilt<T extends Side> = T & { buildState: Exclude<T["buildState"], "ready"> };

function isUnbuilt<T extends Side>(r: T): r is Unbuilt<T> {
  return r.id !== NOTHING_ID && r.buildState !== "ready";
}

/** The sides whose build is not done (the "nothing" side counts as built). */
export function unbuiltOf<T extends Side>(sides: readonly T[]): Unbuilt<T>[] {
  return sides.filter(isUnbuilt);
}

/** "r3 is still building" / "the build of r3 failed" (capitalised when it opens a sentence). */
export function unbuiltSentence(r: Pick<Side, "number" | "buildState">, opensSentence = true): string {
  const words =
    r.buildState === "building" ? `r${r.number} is still building` : `the build of r${r.number} failed`;
  return opensSentence ? words.charAt(0).toUpperCase() + words.slice(1) : words;
}

/** Why the files of a pair cannot be compared yet. */
export function unbuiltFilesSentence(sides: readonly Side[]): string {
  return `No file text to compare yet: ${sides.map((s) => unbuiltSentence(s, false)).join("; ")}.`;
}
