// One retrofit with its working stage and targets.
import "server-only";
import { asc, eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { retrofits, stages, targets, type Retrofit, type TargetRow } from "@/db/schema";
import { validateControl, type Stage, type StageControl } from "@/lib/engine";

export async function getRetrofitById({ id }: { id: number }, tx?: Tx): Promise<Retrofit | null> {
  const [row] = await (tx ?? db).select().from(retrofits).where(eq(retrofits.id, id));
  return row ?? null;
}

export async function getStageByRetrofitId({ retrofitId }: { retrofitId: number }): Promise<Stage | null> {
  const [row] = await db.select().from(stages).where(eq(stages.retrofitId, retrofitId));
  return row ? (row.values as Stage) : null;
}

/** The stored control, or null when there is none or it no longer fits the stored stage. */
export async function getControlByRetrofitId({
  retrofitId,
}: {
  retrofitId: number;
}): Promise<StageControl | null> {
  const [row] = await db.select().from(stages).where(eq(stages.retrofitId, retrofitId));
  if (!row || row.control === null || row.control === undefined) return null;
  try {
    return validateControl(row.values as Stage, row.control);
  } catch {
    return null;
  }
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
  control: StageControl | null;
  targets: TargetRow[];
};

export async function getRetrofitDetail({ id }: { id: number }): Promise<RetrofitDetail | null> {
  const retrofit = await getRetrofitById({ id });
  if (!retrofit) return null;
  const [stage, control, targetRows] = await Promise.all([
    getStageByRetrofitId({ retrofitId: id }),
    getControlByRetrofitId({ retrofitId: id }),
    getTargetsByRetrofitId({ retrofitId: id }),
  ]);
  return { retrofit, stage, control, targets: targetRows };
}
