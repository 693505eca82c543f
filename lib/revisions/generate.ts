// Generating a revision: snapshot the stage and targets, run the engine, build
// the bundle, and store the revision, its files and an audit event in ONE
// transaction. The retrofit row is locked FOR UPDATE first, so concurrent
// generations on one retrofit queue up and get gapless numbers max+1.
// No "server-only" marker: the seed script runs this outside Next.
import { asc, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits, revisionFiles, revisions, stages, targets, type Revision } from "@/db/schema";
import { ApiError, notFound } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import {
  buildBundleFiles,
  sha256Hex,
  zipBundle,
  type BundleSpec,
  type BundleTargetRequest,
  isTextFile,
} from "@/lib/bundle";
import { analyzeStage, ENGINE_VERSION, isEngineError, validateStage, type Stage } from "@/lib/engine";
import { planOne, planRequestOf, snapshotOf } from "./plan-targets";
import type { StoredPlan } from "./types";

export type GeneratedRevision = Omit<Revision, "bundle">;

function stageOf(values: unknown): Stage {
  try {
    return validateStage(values);
  } catch (e) {
    if (!isEngineError(e)) throw e;
    throw new ApiError("unprocessable", `The stored stage is not valid: ${e.message}`, { stage: e.message });
  }
}

export async function generateRevision({
  retrofitId,
  userId,
  note = "",
}: {
  retrofitId: number;
  userId: number;
  note?: string;
}): Promise<GeneratedRevision> {
  return db.transaction(async (tx) => {
    const [retrofit] = await tx.select().from(retrofits).where(eq(retrofits.id, retrofitId)).for("update");
    if (!retrofit) throw notFound("Retrofit");
    if (retrofit.archivedAt) {
      throw new ApiError(
        "conflict",
        "This retrofit is archived; archived retrofits keep their revisions but get no new ones.",
      );
    }
    const [stageRow] = await tx.select().from(stages).where(eq(stages.retrofitId, retrofitId));
    if (!stageRow)
      throw new ApiError("unprocessable", "Enter the old stage before generating a revision.", {
        stage: "Required.",
      });
    const targetRows = await tx
      .select()
      .from(targets)
      .where(eq(targets.retrofitId, retrofitId))
      .orderBy(asc(targets.position), asc(targets.id));
    if (targetRows.length === 0) {
      throw new ApiError("unprocessable", "Add at least one target before generating a revision.", {
        targets: "Add at least one target.",
      });
    }

    const stage = stageOf(stageRow.values);
    const analysis = analyzeStage(stage);
    if (!analysis.oscillates) {
      const why = analysis.checks.filter((c) => c.level === "error").map((c) => c.message);
      throw new ApiError(
        "unprocessable",
        `The old stage does not oscillate: ${why.join(" ") || "check its values."}`,
        {
          stage: why[0] ?? "Does not oscillate.",
        },
      );
    }

    const stored: StoredPlan[] = [];
    const requests: BundleTargetRequest[] = [];
    targetRows.forEach((row, i) => {
      const target = snapshotOf(row);
      const r = planOne(analysis, target, i);
      if (!r.ok) {
        const name = `target ${i + 1} (${row.device}, ${row.clockSource} at ${row.clockHz} Hz)`;
        throw new ApiError("unprocessable", `${name} cannot be planned: ${r.message}`, {
          [`targets.${i}`]: r.message,
        });
      }
      stored.push({ target, plan: r.plan, budget: r.budget });
      // The bundle planner passes the whole request to planTarget, so the clock
      // option travels with it and plan.json records it.
      requests.push(planRequestOf(analysis, target) as BundleTargetRequest);
    });

    const [{ max }] = await tx
      .select({ max: sql<number>`coalesce(max(${revisions.number}), 0)`.mapWith(Number) })
      .from(revisions)
      .where(eq(revisions.retrofitId, retrofitId));
    const number = max + 1;

    const spec: BundleSpec = {
      retrofit: {
        name: retrofit.name,
        site: retrofit.site,
        assetTag: retrofit.assetTag,
        mainsPowered: retrofit.mainsPowered,
        drivesThyristor: retrofit.drivesThyristor,
      },
      revision: number,
      stage,
      targets: requests,
    };
    const files = buildBundleFiles(spec);
    const zip = Buffer.from(await zipBundle(files));
    const bundleSha256 = sha256Hex(zip);

    const [row] = await tx
      .insert(revisions)
      .values({
        retrofitId,
        number,
        spec,
        analysis,
        plans: stored,
        engineVersion: ENGINE_VERSION,
        bundle: zip,
        bundleSha256,
        bundleSize: zip.length,
        note,
        createdBy: userId,
      })
      .returning();
    await tx.insert(revisionFiles).values(
      files.filter(isTextFile).map((f) => ({
        revisionId: row.id,
        path: f.path,
        content: f.content,
        sha256: sha256Hex(f.content),
      })),
    );
    await recordAudit(
      {
        actorId: userId,
        action: "revision.generate",
        subjectType: "revision",
        subjectId: row.id,
        details: { retrofitId, number, bundleSha256, files: files.length, engineVersion: ENGINE_VERSION },
      },
      tx,
    );
    // eslint-disable-next-line @typescript-eslint/no-unused-vars
    const { bundle, ...rest } = row;
    return rest;
  });
}
