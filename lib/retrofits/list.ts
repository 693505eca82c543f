// The retrofits table: search, filters, sort and pagination done in SQL, with
// the state of each retrofit's latest revision.
import "server-only";
import { and, asc, count, desc, eq, ilike, isNotNull, isNull, or, sql, type SQL } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits, revisions, stages, type RevisionState } from "@/db/schema";
import type { ListQuery } from "@/lib/validation/workspace";

export type RetrofitListItem = {
  id: number;
  name: string;
  site: string;
  assetTag: string;
  boardRef: string;
  kind: string | null;
  mainsPowered: boolean;
  drivesThyristor: boolean;
  updatedAt: string;
  archivedAt: string | null;
  latest: { id: number; number: number; state: RevisionState } | null;
};

const latest = db
  .selectDistinctOn([revisions.retrofitId], {
    retrofitId: revisions.retrofitId,
    id: revisions.id,
    number: revisions.number,
    state: revisions.state,
  })
  .from(revisions)
  .orderBy(revisions.retrofitId, desc(revisions.number))
  .as("latest");

function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function whereOf(q: ListQuery): SQL | undefined {
  const parts: (SQL | undefined)[] = [];
  if (q.archived === "exclude") parts.push(isNull(retrofits.archivedAt));
  if (q.archived === "only") parts.push(isNotNull(retrofits.archivedAt));
  if (q.site) parts.push(eq(retrofits.site, q.site));
  if (q.kind) parts.push(eq(stages.kind, q.kind));
  if (q.state === "none") parts.push(isNull(latest.id));
  else if (q.state) parts.push(eq(latest.state, q.state));
  if (q.q) {
    const p = likePattern(q.q);
    parts.push(
      or(
        ilike(retrofits.name, p),
        ilike(retrofits.assetTag, p),
        ilike(retrofits.boardRef, p),
        ilike(retrofits.description, p),
        ilike(retrofits.site, p),
      ),
    );
  }
  return and(...parts);
}

const SORT_COLUMNS = {
  name: retrofits.name,
  site: retrofits.site,
  assetTag: retrofits.assetTag,
  kind: stages.kind,
  state: latest.state,
  updatedAt: retrofits.updatedAt,
} as const;

export async function listRetrofits(query: ListQuery): Promise<{ items: RetrofitListItem[]; total: number }> {
  const where = whereOf(query);
  const column = SORT_COLUMNS[query.sort];
  const order = query.dir === "asc" ? sql`${column} asc nulls first` : sql`${column} desc nulls last`;
  const rows = await db
    .select({
      id: retrofits.id,
      name: retrofits.name,
      site: retrofits.site,
      assetTag: retrofits.assetTag,
      boardRef: retrofits.boardRef,
      kind: stages.kind,
      mainsPowered: retrofits.mainsPowered,
      drivesThyristor: retrofits.drivesThyristor,
      updatedAt: retrofits.updatedAt,
      archivedAt: retrofits.archivedAt,
      latestId: latest.id,
      latestNumber: latest.number,
      latestState: latest.state,
    })
    .from(retrofits)
    .leftJoin(stages, eq(stages.retrofitId, retrofits.id))
    .leftJoin(latest, eq(latest.retrofitId, retrofits.id))
    .where(where)
    .orderBy(order, asc(retrofits.id))
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize);
  const [{ total }] = await db
    .select({ total: count() })
    .from(retrofits)
    .leftJoin(stages, eq(stages.retrofitId, retrofits.id))
    .leftJoin(latest, eq(latest.retrofitId, retrofits.id))
    .where(where);
  return {
    total,
    items: rows.map((r) => ({
      id: r.id,
      name: r.name,
      site: r.site,
      assetTag: r.assetTag,
      boardRef: r.boardRef,
      kind: r.kind,
      mainsPowered: r.mainsPowered,
      drivesThyristor: r.drivesThyristor,
      updatedAt: r.updatedAt.toISOString(),
      archivedAt: r.archivedAt?.toISOString() ?? null,
      latest:
        r.latestId !== null && r.latestNumber !== null && r.latestState !== null
          ? { id: r.latestId, number: r.latestNumber, state: r.latestState }
          : null,
    })),
  };
}

/** Sites that have retrofits, for the filter. */
export async function listRetrofitSites(): Promise<string[]> {
  const rows = await db.selectDistinct({ site: retrofits.site }).from(retrofits).orderBy(asc(retrofits.site));
  return rows.map((r) => r.site);
}
