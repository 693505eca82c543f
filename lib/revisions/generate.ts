// Generating a revision, in two steps.
// startRevision (in the request): snapshot the stage and targets, run the
// engine and refuse what cannot be planned (before any lock), then lock the
// retrofit row FOR UPDATE, read the rows again (re-planning only when they
// changed), and insert the revision in state "building" with the next gapless
// number, together with its build job (one transaction: the row exists exactly
// when its job does).
// buildRevision (on a worker): compile every target from the stored snapshot,
// run each built image in its emulator (emulate-build.ts), then store files,
// images, bundle, emulations and the audit event in ONE transaction and mark it ready; a build that cannot succeed marks it failed with the reason
// and stores nothing else. A worker killed mid-build commits nothing; the
// queue runs the job again and the revision is still "building".
// No "server-only" marker: the seed script runs this outside Next.
import { isDeepStrictEqual } from "node:util";
import { and, asc, eq, sql } from "drizzle-orm";
import { db, type Tx } from "@/db/client";
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
  buildBundleSources,
  FirmwareBuildError,
  sha256Hex,
  zipBundle,
  type BundleFile,
  type BundleSpec,
  type BundleTargetRequest,
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
import { reportProgress } from "@/lib/jobs/progress";
import { emulateBuilt } from "./emulate-build";
import { storedControl } from "@/lib/validation/control";
import type { BuildProgress } from "./build-state";
import { TARGET_FIELDS } from "@/lib/validation/target";
import { oneAtATime } from "./one-at-a-time";
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

/** The rows a revision is made from, as read (nothing planned yet). */
interface SourceRows {
  retrofit: Retrofit | undefined;
  stageRow: typeof stages.$inferSelect | undefined;
  targetRows: (typeof targets.$inferSelect)[];
}

/** Reads the retrofit, its stage and its targets; `lock` takes the retrofit row FOR UPDATE. */
async function readRows(tx: Reader, retrofitId: number, lock: boolean): Promise<SourceRows> {
  const query = tx.select().from(retrofits).where(eq(retrofits.id, retrofitId));
  const [retrofit] = lock ? await query.for("update") : await query;
  if (!retrofit) return { retrofit, stageRow: undefined, targetRows: [] };
  const [stageRow] = await tx.select().from(stages).where(eq(stages.retrofitId, retrofitId));
  const targetRows = await tx
    .select()
    .from(targets)
    .where(eq(targets.retrofitId, retrofitId))
    .orderBy(asc(targets.position), asc(targets.id));
  return { retrofit, stageRow, targetRows };
}

/** Plans everything a revision needs from its rows (CPU only: no connection is held here). */
function planInputs({ retrofit, stageRow, targetRows }: SourceRows): Inputs {
  if (!retrofit) throw notFound("Retrofit");
  if (retrofit.archivedAt) {
    throw new ApiError(
      "conflict",
      "This retrofit is archived; archived retrofits keep their revisions but get no new ones.",
      { state: "archived" },
    );
  }
  if (!stageRow)
    throw new ApiError("unprocessable", "Enter the old stage before generating a revision.", {
      stage: "Required.",
    });
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

/** Planning refusals of the bundle (e.g. a start mode without firmware) surface here, before any row is written. */
function checkSources(spec: BundleSpec): void {
  try {
    buildBundleSources(spec);
  } catch (e) {
    if (e instanceof ApiError) throw e;
    if (!isEngineError(e)) throw e;
    const field = e.field ?? "targets";
    throw new ApiError("unprocessable", e.message, { [field]: e.message });
  }
}

/**
 * Plans the rows and checks that the bundle's sources can be written. The
 * revision number is only printed in the sources, never a reason to refuse, so
 * the check runs with a stand-in number before the real one is taken.
 */
function checkedInputs(rows: SourceRows): Inputs {
  const inputs = planInputs(rows);
  checkSources(specOf(inputs, 0));
  return inputs;
}

export type StartedRevision = { id: number; number: number };

/**
 * Takes the next number and inserts the revision in state "building";
 * `queue(tx, revisionId)` sends its build job in the same transaction.
 * Refusals (no stage, unplannable target, archived) throw and write nothing.
 */
export async function startRevision(
  { retrofitId, userId, note = "" }: { retrofitId: number; userId: number; note?: string },
  queue?: (tx: Tx, revisionId: number) => Promise<unknown>,
): Promise<StartedRevision> {
  // Planning (the stage's tolerance spread) and the bundle's source check take
  // CPU time; they run before the row lock, so requests queued on the lock of
  // one retrofit do not each hold a pool connection through them (a burst of
  // generations starved the pool and answered 500/503). Inside the lock the
  // rows are read again; only when they changed meanwhile is the work redone.
  // Requests for one retrofit then enter the transaction one at a time in this
  // process, so they wait in memory rather than on the lock with a connection.
  const seen = await readRows(db, retrofitId, false);
  const checked = checkedInputs(seen);
  return oneAtATime(`retrofit:${retrofitId}`, () =>
    db.transaction(async (tx) => {
      const now = await readRows(tx, retrofitId, true);
      const inputs = isDeepStrictEqual(now, seen) ? checked : checkedInputs(now);
      const [{ max }] = await tx
        .select({ max: sql<number>`coalesce(max(${revisions.number}), 0)`.mapWith(Number) })
        .from(revisions)
        .where(eq(revisions.retrofitId, retrofitId));
      const number = max + 1;
      const spec = specOf(inputs, number);
      const folders = targetFolders(spec.targets.map((t) => t.device));
      const progress: BuildProgress = Object.fromEntries(
        folders.map((folder, index) => [
          folder,
          { index, device: spec.targets[index].device, step: "queued" },
        ]),
      );
      const [row] = await tx
        .insert(revisions)
        .values({
          retrofitId,
          number,
          spec,
          analysis: inputs.analysis,
          plans: inputs.stored,
          engineVersion: ENGINE_VERSION,
          // No bundle until the build stores one (build_state says so; downloads refuse).
          bundle: Buffer.alloc(0),
          bundleSha256: "",
          bundleSize: 0,
          buildState: "building",
          buildProgress: progress,
          note,
          createdBy: userId,
        })
        .returning({ id: revisions.id, number: revisions.number });
      await queue?.(tx, row.id);
      return row;
    }),
  );
}

/** Why a build cannot succeed however often it is tried (a retry would fail the same way). */
function lastingFailure(e: unknown): { message: string; folder?: string } | null {
  if (e instanceof FirmwareBuildError) return { message: e.message, folder: e.folder };
  if (e instanceof ApiError) return { message: e.message };
  if (isEngineError(e)) return { message: e.message };
  return null;
}

/** Marks a building revision failed with its reason; nothing else of it is written. */
export async function failRevision(revisionId: number, message: string, folder?: string): Promise<void> {
  if (folder) await reportProgress(revisionId, folder, "failed", message);
  await db
    .update(revisions)
    .set({ buildState: "failed", buildError: message })
    .where(and(eq(revisions.id, revisionId), eq(revisions.buildState, "building")));
}

export type BuildOutcome = { state: "ready" | "failed"; revisionId: number; number: number; error?: string };

/**
 * Builds a revision from its stored snapshot. Idempotent: a revision that is
 * no longer building is left alone (a retried job after a commit). Errors that
 * a retry could cure (database gone) are thrown for the queue to retry.
 */
export async function buildRevision(revisionId: number): Promise<BuildOutcome> {
  const [rev] = await db
    .select({
      number: revisions.number,
      retrofitId: revisions.retrofitId,
      spec: revisions.spec,
      buildState: revisions.buildState,
      buildError: revisions.buildError,
      createdBy: revisions.createdBy,
    })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  if (!rev) throw notFound("Revision");
  if (rev.buildState !== "building") {
    return { state: rev.buildState, revisionId, number: rev.number, error: rev.buildError ?? undefined };
  }
  const spec = rev.spec as BundleSpec;
  let files: BundleFile[];
  try {
    files = await buildBundleFiles(spec, {
      // Progress is for the page; a report lost to a database blip must not fail the build.
      onTarget: (folder, step) =>
        reportProgress(revisionId, folder, step).catch((e: Error) =>
          console.error(`revision ${revisionId}: progress not recorded: ${e.message}`),
        ),
    });
  } catch (e) {
    const lasting = lastingFailure(e);
    if (!lasting) throw e;
    await failRevision(revisionId, lasting.message, lasting.folder);
    return { state: "failed", revisionId, number: rev.number, error: lasting.message };
  }
  // Emulation after every target compiled; its results are stored with the rest below.
  const emulations = await emulateBuilt(spec, files, (folder) =>
    reportProgress(revisionId, folder, "emulating").catch((e: Error) =>
      console.error(`revision ${revisionId}: progress not recorded: ${e.message}`),
    ),
  );
  const zip = Buffer.from(await zipBundle(files));
  const bundleSha256 = sha256Hex(zip);

  return db.transaction(async (tx) => {
    // The row lock makes two runs of one job (a retry racing a slow worker) store once.
    const [locked] = await tx
      .select({ buildState: revisions.buildState, progress: revisions.buildProgress })
      .from(revisions)
      .where(eq(revisions.id, revisionId))
      .for("update");
    if (locked?.buildState !== "building") {
      return { state: locked?.buildState ?? "failed", revisionId, number: rev.number };
    }
    await tx.insert(revisionFiles).values(
      files.filter(isTextFile).map((f) => ({
        revisionId,
        path: f.path,
        content: f.content,
        sha256: sha256Hex(f.content),
      })),
    );
    const images = files.filter((f) => !isTextFile(f));
    if (images.length > 0) {
      await tx.insert(revisionImages).values(
        images.map((f) => ({
          revisionId,
          path: f.path,
          content: Buffer.from(f.content as Uint8Array),
          size: f.content.length,
          sha256: sha256Hex(f.content),
        })),
      );
    }
    const done: BuildProgress = Object.fromEntries(
      Object.entries(locked.progress as BuildProgress).map(([k, p]) => [k, { ...p, step: "done" as const }]),
    );
    await tx
      .update(revisions)
      .set({
        bundle: zip,
        bundleSha256,
        bundleSize: zip.length,
        buildState: "ready",
        buildError: null,
        buildProgress: done,
        emulations,
      })
      .where(eq(revisions.id, revisionId));
    await recordAudit(
      {
        actorId: rev.createdBy,
        action: "revision.generate",
        subjectType: "revision",
        subjectId: revisionId,
        details: {
          retrofitId: rev.retrofitId,
          number: rev.number,
          bundleSha256,
          files: files.length,
          engineVersion: ENGINE_VERSION,
          emulations: Object.fromEntries(Object.entries(emulations).map(([f, e]) => [f, e.verdict])),
        },
      },
      tx,
    );
    return { state: "ready" as const, revisionId, number: rev.number };
  });
}

/**
 * Start and build in this process (seed script, test fixtures). A failed
 * build throws its reason as a 422 naming the target, as generation always did.
 */
export async function generateRevision(args: {
  retrofitId: number;
  userId: number;
  note?: string;
}): Promise<GeneratedRevision> {
  const started = await startRevision(args);
  const outcome = await buildRevision(started.id);
  if (outcome.state !== "ready") {
    throw new ApiError(
      "unprocessable",
      outcome.error ?? "The revision did not build.",
      await failedFields(started.id),
    );
  }
  const [row] = await db.select().from(revisions).where(eq(revisions.id, started.id));
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  const { bundle, ...rest } = row;
  return rest;
}

/** The form fields of a failed build: targets.N with the reason, else none. */
export async function failedFields(revisionId: number): Promise<Record<string, string> | undefined> {
  const [row] = await db
    .select({ progress: revisions.buildProgress, error: revisions.buildError })
    .from(revisions)
    .where(eq(revisions.id, revisionId));
  const failed = Object.values((row?.progress ?? {}) as BuildProgress).filter((p) => p.step === "failed");
  if (failed.length === 0) return undefined;
  return Object.fromEntries(
    failed.map((p) => [`targets.${p.index}`, p.reason ?? row?.error ?? "Did not build."]),
  );
}
