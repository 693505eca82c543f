// One retrofit with its working stage and targets.
import "server-only";
import { asc, eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { retrofits, stages, targets, type Retrofit, type TargetRow } from "@/db/schema";
import type { Stage, StageControl } from "@/lib/engine";
import { storedControl } from "@/lib/validation/control";

export async function getRetrofitById({ id }: { id: number }, tx?: Tx): Promise<Retrofit | null> {
  const [row] = await (tx ?? db).select().from(retrofits).where(eq(retrofits.id, id));
  return row ?? null;
}

/** The working stage and its control, from one read of the stage row. */
export async function getStageByRetrofitId({
  retrofitId,
}: {
  retrofitId: number;
}): Promise<{ stage: Stage; control: StageControl | null } | null> {
  const [row] = await db.select().from(stages).where(eq(stages.retrofitId, retrofitId));
  if (!row) return null;
  const stage = row.values as Stage;
  return { stage, control: storedControl(stage, row.control) };
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
  const [stageRow, targetRows] = await Promise.all([
    getStageByRetrofitId({ retrofitId: id }),
    getTargetsByRetrofitId({ retrofitId: id }),
  ]);
  return {
    retrofit,
    stage: stageRow?.stage ?? null,
    control: stageRow?.control ?? null,
    targets: targetRows,
  };
}
