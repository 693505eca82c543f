import "server-only";
// Field queries: approved bundles for the technician's home, revisions and
// retrofits as the check form needs them, and field-check history. Bundle
// bytes are never selected here.
import { and, asc, desc, eq, inArray, isNull, type SQL } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { fieldCheckPhotos, fieldChecks, revisionFiles, retrofits, revisions, users } from "@/db/schema";
import type { AuthUser } from "@/lib/auth/guard";
import { READ_ALL } from "@/lib/auth/roles";
import type { CheckLine, FieldAsset, FieldCheckView, StepResult } from "./shapes";

const revisionColumns = {
  id: revisions.id,
  retrofitId: revisions.retrofitId,
  number: revisions.number,
  state: revisions.state,
  spec: revisions.spec,
  analysis: revisions.analysis,
  plans: revisions.plans,
  bundleSha256: revisions.bundleSha256,
  bundleSize: revisions.bundleSize,
  createdBy: revisions.createdBy,
  decidedAt: revisions.decidedAt,
  supersededAt: revisions.supersededAt,
};

/** Technicians with a site see that site only; everybody else every site. */
function siteFilter(user: Pick<AuthUser, "role" | "site">): SQL | undefined {
  return user.role === "technician" && user.site !== null ? eq(retrofits.site, user.site) : undefined;
}

function devicesOf(spec: unknown): string[] {
  const targets = (spec as { targets?: { device?: unknown }[] } | null)?.targets;
  return Array.isArray(targets) ? targets.map((t) => String(t?.device ?? "")) : [];
}

/** Released revisions (current and superseded) grouped by retrofit, ordered by site and asset. */
export async function listFieldAssets({ user }: { user: AuthUser }): Promise<FieldAsset[]> {
  const rows = await db
    .select({ r: revisionColumns, f: retrofits })
    .from(revisions)
    .innerJoin(retrofits, eq(revisions.retrofitId, retrofits.id))
    .where(and(eq(revisions.state, "released"), isNull(retrofits.archivedAt), siteFilter(user)))
    .orderBy(asc(retrofits.site), asc(retrofits.assetTag), asc(retrofits.id), desc(revisions.number));
  const byRetrofit = new Map<number, FieldAsset>();
  for (const { r, f } of rows) {
    let asset = byRetrofit.get(f.id);
    if (!asset) {
      asset = {
        retrofitId: f.id,
        name: f.name,
        site: f.site,
        assetTag: f.assetTag,
        boardRef: f.boardRef,
        mainsPowered: f.mainsPowered,
        drivesThyristor: f.drivesThyristor,
        bundles: [],
      };
      byRetrofit.set(f.id, asset);
    }
    asset.bundles.push({
      revisionId: r.id,
      number: r.number,
      sha256: r.bundleSha256,
      byteSize: r.bundleSize,
      approvedAt: r.decidedAt?.toISOString() ?? null,
      supersededAt: r.supersededAt?.toISOString() ?? null,
      devices: devicesOf(r.spec),
    });
  }
  return [...byRetrofit.values()];
}

export async function getRevisionWithRetrofit({ id }: { id: number }) {
  const [row] = await db
    .select({ revision: revisionColumns, retrofit: retrofits })
    .from(revisions)
    .innerJoin(retrofits, eq(revisions.retrofitId, retrofits.id))
    .where(eq(revisions.id, id));
  return row ?? null;
}

export async function getRetrofit({ id }: { id: number }) {
  const [row] = await db.select().from(retrofits).where(eq(retrofits.id, id));
  return row ?? null;
}

/** True when the retrofit has an approved revision the technician may read. */
export async function technicianSeesRetrofit({ user, retrofitId }: { user: AuthUser; retrofitId: number }) {
  const [row] = await db
    .select({ id: revisions.id })
    .from(revisions)
    .innerJoin(retrofits, eq(revisions.retrofitId, retrofits.id))
    .where(and(eq(revisions.retrofitId, retrofitId), eq(revisions.state, "released"), siteFilter(user)))
    .limit(1);
  return !!row;
}

export async function getUserEmail({ id }: { id: number }) {
  const [row] = await db.select({ email: users.email, name: users.name }).from(users).where(eq(users.id, id));
  return row ?? null;
}

export type NewFieldCheck = {
  revisionId: number;
  technicianId: number;
  measuredPeriodS: number;
  measuredHighS: number;
  captureId: number | null;
  lines: CheckLine[];
  passed: boolean;
  notes: string;
  signedOffBy: string;
  steps?: StepResult[];
};

export async function insertFieldCheck(input: NewFieldCheck, tx: Tx) {
  const [row] = await tx.insert(fieldChecks).values(input).returning();
  return row;
}

export async function insertFieldCheckPhoto(
  input: { fieldCheckId: number; stepId: string; mediaType: string; content: Buffer; sha256: string },
  tx: Tx,
) {
  const [row] = await tx
    .insert(fieldCheckPhotos)
    .values({ ...input, byteSize: input.content.length })
    .returning({ id: fieldCheckPhotos.id });
  return row;
}

export async function setFieldCheckSteps(id: number, steps: StepResult[], tx: Tx) {
  await tx.update(fieldChecks).set({ steps }).where(eq(fieldChecks.id, id));
}

/** One photo with the check it belongs to (the caller checks read access via listFieldChecks). */
export async function getFieldCheckPhoto({ id }: { id: number }) {
  const [row] = await db.select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.id, id));
  return row ?? null;
}

/** Every photo of one field check (the caller checks read access). */
export async function listFieldCheckPhotos({ fieldCheckId }: { fieldCheckId: number }) {
  return db.select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, fieldCheckId));
}

/** A text file of a revision's bundle (CHECKLIST.md, PINMAP.md), or null. */
export async function getRevisionFile({ revisionId, path }: { revisionId: number; path: string }) {
  const [row] = await db
    .select({ content: revisionFiles.content })
    .from(revisionFiles)
    .where(and(eq(revisionFiles.revisionId, revisionId), eq(revisionFiles.path, path)));
  return row?.content ?? null;
}

/** Field checks by retrofit or revision, newest first. Technicians get checks
 *  of approved revisions of their site only. */
export async function listFieldChecks({
  user,
  retrofitId,
  revisionId,
  ids,
}: {
  user: AuthUser;
  retrofitId?: number;
  revisionId?: number;
  ids?: number[];
}): Promise<FieldCheckView[]> {
  const limitToReadable = READ_ALL.includes(user.role)
    ? undefined
    : and(eq(revisions.state, "released"), siteFilter(user));
  const rows = await db
    .select({
      c: fieldChecks,
      revisionNumber: revisions.number,
      revisionState: revisions.state,
      retrofitId: retrofits.id,
      retrofitName: retrofits.name,
      assetTag: retrofits.assetTag,
      boardRef: retrofits.boardRef,
      technicianName: users.name,
    })
    .from(fieldChecks)
    .innerJoin(revisions, eq(fieldChecks.revisionId, revisions.id))
    .innerJoin(retrofits, eq(revisions.retrofitId, retrofits.id))
    .innerJoin(users, eq(fieldChecks.technicianId, users.id))
    .where(
      and(
        retrofitId === undefined ? undefined : eq(retrofits.id, retrofitId),
        revisionId === undefined ? undefined : eq(revisions.id, revisionId),
        ids === undefined ? undefined : inArray(fieldChecks.id, ids),
        limitToReadable,
      ),
    )
    .orderBy(desc(fieldChecks.createdAt), desc(fieldChecks.id))
    .limit(500);
  return rows.map(({ c, ...r }) => {
    const lines = c.lines as CheckLine[];
    return {
      id: c.id,
      revisionId: c.revisionId,
      revisionNumber: r.revisionNumber,
      revisionState: r.revisionState,
      retrofitId: r.retrofitId,
      retrofitName: r.retrofitName,
      assetTag: r.assetTag,
      boardRef: r.boardRef,
      target: lines[0]?.target ?? null,
      device: lines[0]?.device ?? null,
      technician: { id: c.technicianId, name: r.technicianName },
      measuredPeriodS: c.measuredPeriodS,
      measuredHighS: c.measuredHighS,
      captureId: c.captureId,
      lines,
      passed: c.passed,
      notes: c.notes,
      signedOffBy: c.signedOffBy,
      steps: (c.steps as StepResult[] | null) ?? [],
      createdAt: c.createdAt.toISOString(),
    };
  });
}
