import "server-only";
// Capture queries. Content bytes are selected only where they are needed
// (re-reading a window of the trace), never for lists.
import { and, desc, eq, inArray, type SQL } from "drizzle-orm";
import { db } from "@/db/client";
import { ApiError } from "@/lib/api/errors";
import { captures, retrofits, users } from "@/db/schema";
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

export async function insertCapture(input: {
  retrofitId: number | null;
  uploadedBy: number;
  fileName: string;
  content: Buffer;
  sha256: string;
  measurement: CaptureMeasurement;
}) {
  const [row] = await db
    .insert(captures)
    .values({ ...input, byteSize: input.content.length })
    .returning({ id: captures.id });
  return row.id;
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
