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
import { loadReadableCapture } from "./captures";
import { judgeCheck, requiredRelativeOf, revisionPlans } from "./judge";
import { getRevisionWithRetrofit, getUserEmail, insertFieldCheck, listFieldChecks } from "./queries";
import type { CheckLine, FieldCheckView } from "./shapes";

const seconds = z
  .number({ error: "A time is a JSON number in seconds (0.01 = 10 ms)." })
  .finite()
  .positive("Enter a time greater than zero.");

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
    notes: paragraphText("Notes", { max: 4000 }).default(""),
    signedOffBy: oneLine("Signed off by", { min: 1, max: 200 }),
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

  const author = verdict.passed ? null : await getUserEmail({ id: revision.createdBy });
  const id = await db.transaction(async (tx) => {
    const row = await insertFieldCheck(
      {
        revisionId: revision.id,
        technicianId: user.id,
        measuredPeriodS: periodS,
        measuredHighS: highS,
        captureId: input.captureId ?? null,
        lines: verdict.lines,
        passed: verdict.passed,
        notes: input.notes,
        signedOffBy: input.signedOffBy,
      },
      tx,
    );
    await recordAudit(
      {
        actorId: user.id,
        action: verdict.passed ? "field-check.passed" : "field-check.failed",
        subjectType: "revision",
        subjectId: revision.id,
        details: {
          fieldCheckId: row.id,
          retrofitId: retrofit.id,
          target: input.target,
          periodS,
          highS,
          resolutionS: input.resolutionS ?? null,
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
