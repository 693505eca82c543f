// Revisions and their files. Bundle bytes are read only by the download.
import "server-only";
import { and, asc, desc, eq, getTableColumns } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits, revisionFiles, revisionImages, revisions, users, type Revision } from "@/db/schema";

export type RevisionMeta = Omit<Revision, "bundle">;

// eslint-disable-next-line @typescript-eslint/no-unused-vars
const { bundle: _bundle, ...metaColumns } = getTableColumns(revisions);

export async function listRevisionsByRetrofit({ retrofitId }: { retrofitId: number }) {
  return db
    .select({
      id: revisions.id,
      number: revisions.number,
      state: revisions.state,
      engineVersion: revisions.engineVersion,
      bundleSha256: revisions.bundleSha256,
      buildState: revisions.buildState,
      note: revisions.note,
      createdAt: revisions.createdAt,
      supersededAt: revisions.supersededAt,
      createdByName: users.name,
    })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.createdBy))
    .where(eq(revisions.retrofitId, retrofitId))
    .orderBy(desc(revisions.number));
}

export async function getRevisionById({ id }: { id: number }): Promise<RevisionMeta | null> {
  const [row] = await db.select(metaColumns).from(revisions).where(eq(revisions.id, id));
  return row ?? null;
}

/** What a bundle download needs, in one query: the read rule's inputs and the zip. */
export async function getRevisionDownload({ id }: { id: number }) {
  const [row] = await db
    .select({
      number: revisions.number,
      state: revisions.state,
      bundleSha256: revisions.bundleSha256,
      buildState: revisions.buildState,
      bundle: revisions.bundle,
      site: retrofits.site,
      assetTag: retrofits.assetTag,
    })
    .from(revisions)
    .innerJoin(retrofits, eq(retrofits.id, revisions.retrofitId))
    .where(eq(revisions.id, id));
  return row ?? null;
}

export async function listRevisionFiles({ revisionId }: { revisionId: number }) {
  return db
    .select({ path: revisionFiles.path, sha256: revisionFiles.sha256, content: revisionFiles.content })
    .from(revisionFiles)
    .where(eq(revisionFiles.revisionId, revisionId))
    .orderBy(asc(revisionFiles.path));
}

export async function getRevisionFile({ revisionId, path }: { revisionId: number; path: string }) {
  const [row] = await db
    .select({ path: revisionFiles.path, sha256: revisionFiles.sha256, content: revisionFiles.content })
    .from(revisionFiles)
    .where(and(eq(revisionFiles.revisionId, revisionId), eq(revisionFiles.path, path)));
  return row ?? null;
}

/** The revision's ready-to-flash images (<device>/firmware/*): path, size and sha256, no bytes. */
export async function listRevisionImages({ revisionId }: { revisionId: number }) {
  return db
    .select({ path: revisionImages.path, size: revisionImages.size, sha256: revisionImages.sha256 })
    .from(revisionImages)
    .where(eq(revisionImages.revisionId, revisionId))
    .orderBy(asc(revisionImages.path));
}

export async function getRevisionImage({ revisionId, path }: { revisionId: number; path: string }) {
  const [row] = await db
    .select({ path: revisionImages.path, sha256: revisionImages.sha256, content: revisionImages.content })
    .from(revisionImages)
    .where(and(eq(revisionImages.revisionId, revisionId), eq(revisionImages.path, path)));
  return row ?? null;
}
