// One retrofit with its working stage and targets.
import "server-only";
import { asc, eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { retrofits, stages, targets, type Retrofit, type TargetRow } from "@/db/schema";
import type { Stage } from "@/lib/engine";

export async function getRetrofitById({ id }: { id: number }, tx?: Tx): Promise<Retrofit | null> {
  const [row] = await (tx ?? db).select().from(retrofits).where(eq(retrofits.id, id));
  return row ?? null;
}

export async function getStageByRetrofitId({ retrofitId }: { retrofitId: number }): Promise<Stage | null> {
  const [row] = await db.select().from(stages).where(eq(stages.retrofitId, retrofitId));
  return row ? (row.values as Stage) : null;
}

export async function getTargetsByRetrofitId({ retrofitId }: { retrofitId: number }): Promise<TargetRow[]> {
  return db
    .select()
    .from(targets)
    .where(eq(targets.retrofitId, retrofitId))
    .orderBy(asc(targets.position), asc(targets.id));
}

export type RetrofitDetail = {
  retrofit: Retrofit;
  stage: Stage | null;
  targets: TargetRow[];
};

export async function getRetrofitDetail({ id }: { id: number }): Promise<RetrofitDetail | null> {
  const retrofit = await getRetrofitById({ id });
  if (!retrofit) return null;
  const [stage, targetRows] = await Promise.all([
    getStageByRetrofitId({ retrofitId: id }),
    getTargetsByRetrofitId({ retrofitId: id }),
  ]);
  return { retrofit, stage, targets: targetRows };
}
