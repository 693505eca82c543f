// Creating, editing and archiving retrofits. Each change and its audit event
// go in one transaction; targets are replaced as a whole list, in order.
import "server-only";
import { eq } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
import { retrofits, stages, targets, type Retrofit } from "@/db/schema";
import { ApiError, notFound } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { Stage, StageControl } from "@/lib/engine";
import type { RetrofitFacts } from "@/lib/validation/retrofit";
import type { Target } from "@/lib/validation/target";
import { gateDriveOf, triggerOf } from "@/lib/revisions/plan-targets";

// control undefined leaves a stored control as it is (reads drop one that no longer fits the stage).
async function putStage(tx: Tx, retrofitId: number, stage: Stage, control?: StageControl | null) {
  const kept = control === undefined ? {} : { control };
  await tx
    .insert(stages)
    .values({ retrofitId, kind: stage.kind, values: stage, ...kept })
    .onConflictDoUpdate({
      target: stages.retrofitId,
      set: { kind: stage.kind, values: stage, ...kept, captureId: null, updatedAt: new Date() },
    });
}

async function putTargets(tx: Tx, retrofitId: number, list: Target[]) {
  await tx.delete(targets).where(eq(targets.retrofitId, retrofitId));
  if (list.length === 0) return;
  await tx.insert(targets).values(
    list.map((t, position) => ({
      retrofitId,
      position,
      device: t.device,
      clockSource: t.clockSource,
      clockHz: t.clockHz,
      clockAccuracyPpm: t.clockAccuracyPpm ?? null,
      mode: t.mode ?? null,
      timer: t.timer ? t.timer.toUpperCase() : null,
      pin: t.pin ?? null,
      activeLow: t.activeLow,
      requiredTolerancePct: t.requiredTolerancePct ?? null,
      trigger: triggerOf(t),
      gateDrive: gateDriveOf(t),
    })),
  );
}

export async function createRetrofit({
  input,
  userId,
}: {
  input: RetrofitFacts & { stage?: Stage; control?: StageControl | null; targets?: Target[] };
  userId: number;
}): Promise<Retrofit> {
  return db.transaction(async (tx) => {
    const { stage, control, targets: list, ...facts } = input;
    const [row] = await tx
      .insert(retrofits)
      .values({ ...facts, createdBy: userId })
      .returning();
    if (stage) await putStage(tx, row.id, stage, control);
    if (list) await putTargets(tx, row.id, list);
    await recordAudit(
      {
        actorId: userId,
        action: "retrofit.create",
        subjectType: "retrofit",
        subjectId: row.id,
        details: { name: row.name },
      },
      tx,
    );
    return row;
  });
}

export async function updateRetrofit({
  id,
  input,
  userId,
}: {
  id: number;
  input: Partial<RetrofitFacts> & { stage?: Stage; control?: StageControl | null; targets?: Target[] };
  userId: number;
}): Promise<Retrofit> {
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(retrofits).where(eq(retrofits.id, id)).for("update");
    if (!current) throw notFound("Retrofit");
    if (current.archivedAt)
      throw new ApiError("conflict", "This retrofit is archived and can no longer be edited.");
    const { stage, control, targets: list, ...facts } = input;
    const [row] = await tx
      .update(retrofits)
      .set({ ...facts, updatedAt: new Date() })
      .where(eq(retrofits.id, id))
      .returning();
    if (stage) await putStage(tx, id, stage, control);
    if (list) await putTargets(tx, id, list);
    const changed = [...Object.keys(facts), ...(stage ? ["stage"] : []), ...(list ? ["targets"] : [])];
    await recordAudit(
      {
        actorId: userId,
        action: "retrofit.update",
        subjectType: "retrofit",
        subjectId: id,
        details: { changed },
      },
      tx,
    );
    return row;
  });
}

export async function archiveRetrofit({ id, userId }: { id: number; userId: number }): Promise<Retrofit> {
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(retrofits).where(eq(retrofits.id, id)).for("update");
    if (!current) throw notFound("Retrofit");
    if (current.archivedAt) return current;
    const now = new Date();
    const [row] = await tx
      .update(retrofits)
      .set({ archivedAt: now, updatedAt: now })
      .where(eq(retrofits.id, id))
      .returning();
    await recordAudit(
      { actorId: userId, action: "retrofit.archive", subjectType: "retrofit", subjectId: id },
      tx,
    );
    return row;
  });
}
