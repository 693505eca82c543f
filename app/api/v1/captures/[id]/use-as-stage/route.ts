// POST: make a capture's measurement the retrofit's stage ("measured" kind:
// mean period and mean pulse duration), keeping the link to the capture.
import { eq, sql } from "drizzle-orm";
import { z } from "zod";
import { dbId } from "@/lib/validation/id";
import { measurementProblems } from "@/lib/validation/measurement";
import { db } from "@/db/client";
import { captures, retrofits, stages } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, parseId, readOptionalJson } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit";
import { requireUser } from "@/lib/auth/guard";
import { EDIT } from "@/lib/auth/roles";
import type { CaptureMeasurement } from "@/lib/capture";
import { analyzeStage } from "@/lib/engine";
import { loadReadableCapture } from "@/lib/field/captures";
import { getRetrofit } from "@/lib/field/queries";
import { lockLiveRetrofit } from "@/lib/retrofits/live-lock";

const bodySchema = z.object({ retrofitId: dbId.optional() }).strict();

export const POST = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Capture");
  const body = bodySchema.parse(await readOptionalJson(req));
  const user = await requireUser({ roles: EDIT, req });
  const capture = await loadReadableCapture({ id, user });

  const retrofitId = body.retrofitId ?? capture.retrofitId;
  if (retrofitId === null) {
    throw new ApiError("bad_request", "Say which retrofit the stage is for.", {
      retrofitId: "Choose a retrofit.",
    });
  }
  if (capture.retrofitId !== null && capture.retrofitId !== retrofitId) {
    // Another retrofit's capture answers like a missing one (no oracle).
    throw new ApiError("not_found", "Capture was not found.");
  }
  const retrofit = await getRetrofit({ id: retrofitId });
  if (!retrofit) throw new ApiError("not_found", "Retrofit was not found.");

  const m = capture.measurement as CaptureMeasurement;
  const stage = { kind: "measured" as const, periodS: m.periodS.mean, highS: m.highS.mean };
  const problems = measurementProblems(stage);
  if (Object.keys(problems).length > 0)
    throw new ApiError("unprocessable", Object.values(problems).join(" "), problems);
  analyzeStage(stage); // a measurement the engine cannot use is a 422, not a broken stage

  await db.transaction(async (tx) => {
    await lockLiveRetrofit(tx, retrofitId, "change its stage");
    const [previous] = await tx
      .select({ kind: stages.kind })
      .from(stages)
      .where(eq(stages.retrofitId, retrofitId));
    await tx
      .insert(stages)
      .values({ retrofitId, kind: stage.kind, values: stage, captureId: id })
      .onConflictDoUpdate({
        target: stages.retrofitId,
        set: { kind: stage.kind, values: stage, captureId: id, updatedAt: sql`now()` },
      });
    await tx
      .update(retrofits)
      .set({ updatedAt: sql`now()` })
      .where(eq(retrofits.id, retrofitId));
    if (capture.retrofitId === null) await tx.update(captures).set({ retrofitId }).where(eq(captures.id, id));
    await recordAudit(
      {
        actorId: user.id,
        action: "stage.from-capture",
        subjectType: "retrofit",
        subjectId: retrofitId,
        details: {
          captureId: id,
          periodS: stage.periodS,
          highS: stage.highS,
          previousKind: previous?.kind ?? null,
        },
      },
      tx,
    );
  });
  return Response.json({ stage: { retrofitId, captureId: id, ...stage } }, { status: 200 });
});
