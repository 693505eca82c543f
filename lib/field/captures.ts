import "server-only";
// Capture queries. Content bytes are selected only where they are needed
// (re-reading a window of the trace), never for lists.
import { and, asc, desc, eq, inArray, type SQL } from "drizzle-orm";
import { db } from "@/db/client";
import { ApiError } from "@/lib/api/errors";
import { captures, fieldChecks, retrofits, stages, users } from "@/db/schema";
import { recordAudit } from "@/lib/audit";
import { parseCapture, type CaptureOptions, type CaptureTrace } from "@/lib/capture";
import { buildLevels, storeLevels } from "./capture-levels";
import { checkCaptureQuota } from "./capture-quotas";
import type { AuthUser } from "@/lib/auth/guard";
import { READ_ALL } from "@/lib/auth/roles";
import type { CaptureMeasurement } from "@/lib/capture";
import { technicianSeesRetrofit } from "./queries";
import type { CaptureView, MeasurementSummary } from "./shapes";

const listColumns = {
  id: captures.id,
  retrofitId: captures.retrofitId,
  uploadedBy: captures.uploadedBy,
  uploaderName: users.name,
  fileName: captures.fileName,
  byteSize: captures.byteSize,
  sha256: captures.sha256,
  createdAt: captures.createdAt,
  measurement: captures.measurement,
};

type CaptureRow = {
  id: number;
  retrofitId: number | null;
  uploadedBy: number;
  uploaderName: string;
  fileName: string;
  byteSize: number;
  sha256: string;
  createdAt: Date;
  measurement: unknown;
};

export function summary(m: CaptureMeasurement): MeasurementSummary {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars -- dropped on purpose: display data
  const { plot, edges, ...rest } = m;
  return rest;
}

function toView(r: CaptureRow): CaptureView {
  return {
    id: r.id,
    retrofitId: r.retrofitId,
    uploadedBy: { id: r.uploadedBy, name: r.uploaderName },
    fileName: r.fileName,
    byteSize: r.byteSize,
    sha256: r.sha256,
    createdAt: r.createdAt.toISOString(),
    measurement: summary(r.measurement as CaptureMeasurement),
  };
}

/** The samples of stored content, for captures whose levels were not made at upload. */
/** Parses a stored file again, with the channel and probe the capture is measured with. */
export async function traceOf(
  content: Buffer,
  options: Omit<CaptureOptions, "maxBytes"> = {},
): Promise<CaptureTrace> {
  return parseCapture(
    (async function* () {
      yield content;
    })(),
    { ...options, maxBytes: content.length + 1 },
  );
}

/** Stores a capture with its levels in one transaction, within the quotas
 *  (lib/field/capture-quotas.ts). Without `trace` the content is parsed here. */
export async function insertCapture(input: {
  retrofitId: number | null;
  uploadedBy: number;
  fileName: string;
  content: Buffer;
  sha256: string;
  measurement: CaptureMeasurement;
  trace?: Pick<CaptureTrace, "t" | "v">;
}) {
  const { trace: given, ...fields } = input;
  const trace = given ?? (await traceOf(input.content));
  return db.transaction(async (tx) => {
    await checkCaptureQuota(
      { uploadedBy: input.uploadedBy, retrofitId: input.retrofitId, bytes: input.content.length },
      tx,
    );
    const [row] = await tx
      .insert(captures)
      .values({ ...fields, byteSize: input.content.length })
      .returning({ id: captures.id });
    await storeLevels(tx, buildLevels(row.id, trace.t, trace.v));
    return row.id;
  });
}

export async function getCaptureRow({ id }: { id: number }) {
  const [row] = await db
    .select(listColumns)
    .from(captures)
    .innerJoin(users, eq(captures.uploadedBy, users.id))
    .where(eq(captures.id, id));
  return (row as CaptureRow | undefined) ?? null;
}

export async function getCaptureContent({ id }: { id: number }): Promise<Buffer | null> {
  const [row] = await db.select({ content: captures.content }).from(captures).where(eq(captures.id, id));
  return row?.content ?? null;
}

/** Technicians read their own uploads and captures of retrofits whose approved
 *  revisions they may read; the other roles read every capture. */
export async function canReadCapture({
  user,
  row,
}: {
  user: AuthUser;
  row: { uploadedBy: number; retrofitId: number | null };
}) {
  if (READ_ALL.includes(user.role)) return true;
  if (user.role !== "technician") return false;
  if (row.uploadedBy === user.id) return true;
  return row.retrofitId !== null && technicianSeesRetrofit({ user, retrofitId: row.retrofitId });
}

export function captureView(row: CaptureRow): CaptureView {
  return toView(row);
}

export async function listCaptures({
  user,
  retrofitId,
}: {
  user: AuthUser;
  retrofitId?: number;
}): Promise<CaptureView[]> {
  let scope: SQL | undefined;
  if (!READ_ALL.includes(user.role)) {
    // Technicians: own uploads, or all of a retrofit they may see.
    const seesRetrofit = retrofitId !== undefined && (await technicianSeesRetrofit({ user, retrofitId }));
    scope = seesRetrofit ? undefined : eq(captures.uploadedBy, user.id);
  }
  const rows = await db
    .select(listColumns)
    .from(captures)
    .innerJoin(users, eq(captures.uploadedBy, users.id))
    .where(and(retrofitId === undefined ? undefined : eq(captures.retrofitId, retrofitId), scope))
    .orderBy(desc(captures.createdAt), desc(captures.id))
    .limit(200);
  return (rows as CaptureRow[]).map(toView);
}

/** Asset tags of the retrofits a capture list refers to, so a list on a
 *  phone can say which machine each trace came from. Callers pass ids from
 *  captures they may already read. */
export async function assetTagsFor(retrofitIds: number[]): Promise<Map<number, string>> {
  const ids = [...new Set(retrofitIds)];
  if (ids.length === 0) return new Map();
  const rows = await db
    .select({ id: retrofits.id, assetTag: retrofits.assetTag })
    .from(retrofits)
    .where(inArray(retrofits.id, ids));
  return new Map(rows.map((r) => [r.id, r.assetTag]));
}

/** Load by id and apply the read rule, with the same 404 for "missing" and
 *  "not yours" so ids reveal nothing. */
export async function loadReadableCapture({ id, user }: { id: number; user: AuthUser }) {
  const row = await getCaptureRow({ id });
  if (!row || !(await canReadCapture({ user, row })))
    throw new ApiError("not_found", "Capture was not found.");
  return row;
}

/** Deletes a capture for its uploader or an admin, when no field check cites it.
 *  Under the capture's row lock; a stage made from it keeps its values and loses
 *  the link. Audited in the same transaction. */
export async function deleteCapture({ id, user }: { id: number; user: AuthUser }) {
  const row = await loadReadableCapture({ id, user });
  if (user.role !== "admin" && row.uploadedBy !== user.id)
    throw new ApiError(
      "forbidden",
      `Only ${row.uploaderName}, who uploaded it, or an admin may delete this capture.`,
    );
  try {
    return await db.transaction(async (tx) => {
      const [locked] = await tx
        .select({ id: captures.id })
        .from(captures)
        .where(eq(captures.id, id))
        .for("update");
      if (!locked) throw new ApiError("not_found", "Capture was not found.");
      const citing = await tx
        .select({ id: fieldChecks.id })
        .from(fieldChecks)
        .where(eq(fieldChecks.captureId, id))
        .orderBy(asc(fieldChecks.id));
      if (citing.length > 0) throw citedBy(citing.map((c) => c.id));
      const unlinked = await tx
        .update(stages)
        .set({ captureId: null })
        .where(eq(stages.captureId, id))
        .returning({ retrofitId: stages.retrofitId });
      await tx.delete(captures).where(eq(captures.id, id));
      await recordAudit(
        {
          actorId: user.id,
          action: "capture.delete",
          subjectType: "capture",
          subjectId: id,
          details: {
            fileName: row.fileName,
            byteSize: row.byteSize,
            sha256: row.sha256,
            retrofitId: row.retrofitId,
            uploadedBy: row.uploadedBy,
            stagesUnlinked: unlinked.map((s) => s.retrofitId),
          },
        },
        tx,
      );
      return { id, fileName: row.fileName };
    });
  } catch (e) {
    // A field check citing it committed between the check and the delete (SQLSTATE 23503).
    if (
      (e as { code?: string; cause?: { code?: string } }).code === "23503" ||
      (e as { cause?: { code?: string } }).cause?.code === "23503"
    ) {
      const citing = await db
        .select({ id: fieldChecks.id })
        .from(fieldChecks)
        .where(eq(fieldChecks.captureId, id));
      throw citedBy(citing.map((c) => c.id));
    }
    throw e;
  }
}

function citedBy(ids: number[]): ApiError {
  const list =
    ids
      .slice(0, 10)
      .map((i) => `#${i}`)
      .join(", ") + (ids.length > 10 ? ` and ${ids.length - 10} more` : "");
  return new ApiError(
    "conflict",
    `This capture is the evidence of field check${ids.length === 1 ? "" : "s"} ${list}; it is kept as long as they cite it.`,
    { fieldChecks: ids.join(",") },
  );
}
