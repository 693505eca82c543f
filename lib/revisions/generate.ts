// Generating a revision: snapshot the stage and targets, run the engine, build
// the bundle, and store the revision, its files and an audit event in ONE
// transaction. The retrofit row is locked FOR UPDATE first, so concurrent
// generations on one retrofit queue up and get gapless numbers max+1.
// No "server-only" marker: the seed script runs this outside Next.
import { asc, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import {
  retrofits,
  revisionFiles,
  revisionImages,
  revisions,
  stages,
  targets,
  type Retrofit,
  type Revision,
} from "@/db/schema";
import { ApiError, notFound } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import {
  buildBundleFiles,
  FirmwareBuildError,
  sha256Hex,
  zipBundle,
  type BundleFile,
  type BundleSpec,
  type BundleTargetRequest,
  type PrebuiltImages,
  isTextFile,
} from "@/lib/bundle";
import { targetFolders } from "@/lib/bundle/folders";
import {
  analyzeStage,
  ENGINE_VERSION,
  isEngineError,
  validateStage,
  type Stage,
  type StageControl,
} from "@/lib/engine";
import { storedControl } from "@/lib/validation/control";
import { TARGET_FIELDS } from "@/lib/validation/target";
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

type Reader = Pick<typeof db, "select">;

interface Inputs {
  retrofit: Retrofit;
  analysis: ReturnType<typeof analyzeStage>;
  stage: Stage;
  /** the stage's adjustable value, null when it has none or it no longer fits the stage */
  control: StageControl | null;
  stored: StoredPlan[];
  requests: BundleTargetRequest[];
}

/** Reads and plans everything a revision needs; `lock` takes the retrofit row FOR UPDATE. */
async function loadInputs(tx: Reader, retrofitId: number, lock: boolean): Promise<Inputs> {
  const query = tx.select().from(retrofits).where(eq(retrofits.id, retrofitId));
  const [retrofit] = lock ? await query.for("update") : await query;
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
      // The row and, where the engine names one, the field itself, so the form
      // marks the field as the live plan did (not only a message under the button).
      const fields: Record<string, string> = { [`targets.${i}`]: r.message };
      if (r.field && TARGET_FIELDS.has(r.field)) fields[`targets.${i}.${r.field}`] = r.message;
      throw new ApiError("unprocessable", `${name} cannot be planned: ${r.message}`, fields);
    }
    stored.push({ target, plan: r.plan, budget: r.budget });
    // The bundle planner passes the whole request to planTarget, so the clock
    // option travels with it and plan.json records it.
    // The required tolerance travels too, so the printed limits and the field
    // check's judge (which reads the stored budget) use the same number.
    const request = planRequestOf(analysis, target) as BundleTargetRequest;
    if (r.budget && r.budget.requiredPpm > 0) request.requiredTolerancePct = r.budget.requiredPpm / 1e4;
    requests.push(request);
  });
  return { retrofit, analysis, stage, control: storedControl(stage, stageRow.control), stored, requests };
}

function specOf(inputs: Inputs, number: number): BundleSpec {
  const { retrofit } = inputs;
  return {
    retrofit: {
      name: retrofit.name,
      site: retrofit.site,
      assetTag: retrofit.assetTag,
      mainsPowered: retrofit.mainsPowered,
      drivesThyristor: retrofit.drivesThyristor,
    },
    revision: number,
    stage: inputs.stage,
    control: inputs.control,
    targets: inputs.requests,
  };
}

/** The full bundle; an image that does not build is a 422 naming the target, and nothing is stored. */
async function bundleOf(spec: BundleSpec, prebuilt: PrebuiltImages): Promise<BundleFile[]> {
  try {
    return await buildBundleFiles(spec, { prebuilt });
  } catch (e) {
    if (!(e instanceof FirmwareBuildError)) throw e;
    const i = Math.max(0, targetFolders(spec.targets.map((t) => t.device)).indexOf(e.folder));
    throw new ApiError("unprocessable", `Target ${i + 1}: ${e.message}`, { [`targets.${i}`]: e.message });
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
  // Compile the images before taking the row lock: they do not depend on the
  // revision number, and a compiler run must not hold other generations up.
  // Inside the lock the inputs are read again; the images are reused only
  // where the sources are the same (PrebuiltImages is keyed by their sha256).
  const prebuilt: PrebuiltImages = new Map();
  await bundleOf(specOf(await loadInputs(db, retrofitId, false), 0), prebuilt);

  return db.transaction(async (tx) => {
    const inputs = await loadInputs(tx, retrofitId, true);
    const { analysis, stored } = inputs;

    const [{ max }] = await tx
      .select({ max: sql<number>`coalesce(max(${revisions.number}), 0)`.mapWith(Number) })
      .from(revisions)
      .where(eq(revisions.retrofitId, retrofitId));
    const number = max + 1;

    const spec = specOf(inputs, number);
    const files = await bundleOf(spec, prebuilt);
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
    const images = files.filter((f) => !isTextFile(f));
    if (images.length > 0) {
      await tx.insert(revisionImages).values(
        images.map((f) => ({
          revisionId: row.id,
          path: f.path,
          content: Buffer.from(f.content as Uint8Array),
          size: f.content.length,
          sha256: sha256Hex(f.content),
        })),
      );
    }
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
