import "server-only";
// Records a field check against an approved revision: the server computes the
// checklist limits and the verdict; a failed check e-mails the revision's author.
import { z } from "zod";
import { dbId } from "@/lib/validation/id";
import { measurementProblems } from "@/lib/validation/measurement";
import { lineText as oneLine, paragraphText } from "@/lib/validation/plain-text";
import { db } from "@/db/client";
import { ApiError } from "@/lib/api/errors";
import { recordAudit } from "@/lib/audit";
import type { AuthUser } from "@/lib/auth/guard";
import type { CaptureMeasurement } from "@/lib/capture";
import { formatEng } from "@/lib/engine";
import { enqueueMail } from "@/lib/mail/outbox";
import { assertCanReadRevision } from "@/lib/revisions/access";
import { createHash } from "node:crypto";
import { targetFolders } from "@/lib/bundle/folders";
import { loadReadableCapture } from "./captures";
import { lockLiveRetrofit } from "@/lib/retrofits/live-lock";
import { judgeSteps, stepInputSchema } from "./record-steps";
import { judgeCheck, requiredRelativeOf, revisionPlans } from "./judge";
import {
  getRevisionFile,
  getRevisionWithRetrofit,
  getUserEmail,
  insertFieldCheck,
  insertFieldCheckPhoto,
  listFieldChecks,
  setFieldCheckSteps,
} from "./queries";
import type { CheckLine, FieldCheckView, StepResult } from "./shapes";

const seconds = z
  .number({ error: "A time is a JSON number in seconds (0.01 = 10 ms)." })
  .finite()
  .positive("Enter a time greater than zero.");

/** Body limit of POST /api/v1/field-checks: room for the checklist lines' photos (6 MB decoded, base64 in JSON). */
export const FIELD_CHECK_MAX_BYTES = 9 * 1024 * 1024;

export const fieldCheckSchema = z
  .object({
    revisionId: dbId,
    target: z
      .number({ error: "target is the target's index, a whole number from 0." })
      .int("target is a whole number from 0.")
      .min(0, "target is a whole number from 0.")
      .default(0),
    measuredPeriodS: seconds.optional(),
    measuredHighS: seconds.optional(),
    /** Reading resolution of the instrument (scope cursor step, counter's last digit); widens each limit. */
    resolutionS: z
      .number({ error: "Resolution is a JSON number in seconds." })
      .finite()
      .min(0, "Resolution must not be negative.")
      .max(1, "Resolution is at most 1 s.")
      .optional(),
    captureId: dbId.optional(),
    notes: z._default(paragraphText("Notes", { max: 4000 }), ""),
    signedOffBy: oneLine("The signature (your name)", { min: 1, max: 200 }),
    /** Lines of the target's CHECKLIST.md ticked or measured on the phone (optional; older clients send none). */
    steps: z.array(stepInputSchema).max(200).optional(),
  })
  .strict()
  .superRefine((c, ctx) => {
    // Bounds from the devices (lib/validation/measurement.ts): 5e-324 s or a
    // period in millennia is a slip, not a reading.
    const problems = measurementProblems(
      { periodS: c.measuredPeriodS, highS: c.measuredHighS },
      { periodS: "measuredPeriodS", highS: "measuredHighS" },
      { periodS: "Measured period", highS: "Measured high time" },
    );
    for (const [field, message] of Object.entries(problems))
      ctx.addIssue({ code: "custom", message, path: [field] });
  });

export type FieldCheckInput = z.infer<typeof fieldCheckSchema>;

function lineText(l: CheckLine): string {
  const f = (x: number) => (l.unit === "" ? formatEng(x, "%", 4) : formatEng(x, l.unit, 6));
  const verdict = l.derived ? "info" : l.pass ? "pass" : "FAIL";
  return `${verdict}  ${l.label}: measured ${f(l.measured)}, limits ${f(l.min)} .. ${f(l.max)}${l.source ? ` (${l.source})` : ""}`;
}

export async function recordFieldCheck(user: AuthUser, input: FieldCheckInput): Promise<FieldCheckView> {
  const found = await getRevisionWithRetrofit({ id: input.revisionId });
  if (!found) throw new ApiError("not_found", "Revision was not found.");
  const { revision, retrofit } = found;
  assertCanReadRevision(user, revision, retrofit);
  if (revision.state !== "released") {
    throw new ApiError(
      "conflict",
      `r${revision.number} is ${revision.state.replace("_", " ")}; only revisions released for the field are checked there.`,
    );
  }

  let periodS = input.measuredPeriodS;
  let highS = input.measuredHighS;
  if (input.captureId !== undefined) {
    const capture = await loadReadableCapture({ id: input.captureId, user });
    // Evidence of another retrofit answers like a missing capture (no oracle).
    if (capture.retrofitId !== null && capture.retrofitId !== retrofit.id)
      throw new ApiError("not_found", "Capture was not found.");
    const m = capture.measurement as CaptureMeasurement;
    periodS ??= m.periodS.mean;
    highS ??= m.highS.mean;
  }
  if (periodS === undefined || highS === undefined) {
    const fields: Record<string, string> = {};
    if (periodS === undefined) fields.measuredPeriodS = "Enter the measured period, or pick a capture.";
    if (highS === undefined) fields.measuredHighS = "Enter the measured high time, or pick a capture.";
    throw new ApiError("bad_request", "The check needs a measured period and high time.", fields);
  }

  const plans = revisionPlans(revision.plans);
  const plan = plans[input.target];
  if (!plan) {
    throw new ApiError(
      "bad_request",
      `r${revision.number} has ${plans.length} target(s); target ${input.target + 1} does not exist.`,
      {
        target: "Choose one of the revision's targets.",
      },
    );
  }
  const verdict = judgeCheck(
    plan,
    revision.analysis,
    { periodS, highS, resolutionS: input.resolutionS },
    input.target,
    requiredRelativeOf(revision.plans, input.target),
  );

  let steps: ReturnType<typeof judgeSteps> | null = null;
  if (input.steps) {
    const devices = ((revision.spec as { targets?: { device: string }[] }).targets ?? []).map(
      (t) => t.device,
    );
    const folder = targetFolders(devices)[input.target];
    const markdown = folder
      ? await getRevisionFile({ revisionId: revision.id, path: `${folder}/CHECKLIST.md` })
      : null;
    if (markdown === null) {
      throw new ApiError(
        "unprocessable",
        `r${revision.number} has no checklist for target ${input.target + 1}.`,
        {
          steps: "Record the check without checklist lines.",
        },
      );
    }
    steps = judgeSteps(markdown, input.steps, { lines: verdict.lines, target: input.target });
  }
  const passed = verdict.passed && (steps?.passed ?? true);
  // The bench period/high lines repeat verdict.lines; the mail lists the other failed lines.
  const failedSteps = (steps?.results ?? []).filter((r) => r.pass === false && r.measured !== "");

  const author = passed ? null : await getUserEmail({ id: revision.createdBy });
  const id = await db.transaction(async (tx) => {
    await lockLiveRetrofit(tx, retrofit.id, `record a field check of r${revision.number}`);
    const row = await insertFieldCheck(
      {
        revisionId: revision.id,
        technicianId: user.id,
        measuredPeriodS: periodS,
        measuredHighS: highS,
        captureId: input.captureId ?? null,
        lines: verdict.lines,
        passed,
        notes: input.notes,
        signedOffBy: input.signedOffBy,
        steps: steps?.results ?? [],
      },
      tx,
    );
    if (steps) {
      const photoIds = new Map<string, number>();
      for (const p of steps.photos) {
        const sha256 = createHash("sha256").update(p.content).digest("hex");
        const photo = await insertFieldCheckPhoto({ fieldCheckId: row.id, ...p, sha256 }, tx);
        photoIds.set(p.stepId, photo.id);
      }
      if (photoIds.size) {
        const withPhotos: StepResult[] = steps.results.map((r) =>
          photoIds.has(r.id) ? { ...r, photoId: photoIds.get(r.id) } : r,
        );
        await setFieldCheckSteps(row.id, withPhotos, tx);
      }
    }
    await recordAudit(
      {
        actorId: user.id,
        action: passed ? "field-check.passed" : "field-check.failed",
        subjectType: "revision",
        subjectId: revision.id,
        details: {
          fieldCheckId: row.id,
          retrofitId: retrofit.id,
          target: input.target,
          periodS,
          highS,
          resolutionS: input.resolutionS ?? null,
          steps: steps ? steps.results.filter((r) => r.done).length : null,
          photos: steps ? steps.photos.length : 0,
        },
      },
      tx,
    );
    if (author) {
      await enqueueMail(
        [
          {
            kind: "field-check-failed",
            to: author.email,
            subject: `Field check failed: ${retrofit.name} (${retrofit.assetTag}) r${revision.number}`,
            body: [
              `A field check of r${revision.number} of "${retrofit.name}" at ${retrofit.site}, asset ${retrofit.assetTag}, failed.`,
              `Target ${input.target + 1}: ${plan.device}.`,
              "",
              ...verdict.lines.map(lineText),
              ...failedSteps.map(
                (r) => `FAIL  ${r.id} ${r.text}: measured ${r.measured}, limits ${r.limits}`,
              ),
              "",
              `Signed off by ${input.signedOffBy} (${user.name}).`,
              input.notes ? `Notes: ${input.notes}` : "No notes.",
              "",
              `Field history: /field/retrofits/${retrofit.id}`,
            ].join("\n"),
          },
        ],
        tx,
      );
    }
    return row.id;
  });
  const [view] = await listFieldChecks({ user, ids: [id] });
  return view;
}
