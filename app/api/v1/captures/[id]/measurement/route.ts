// POST { channel, probe }: measure the stored file again with another channel
// or probe attenuation and keep that measurement. A choice the file cannot
// have is a 422 and the stored measurement stays as it was. A stage already
// made from the capture keeps its values until "use as measured stage" again.
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { captures } from "@/db/schema";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, parseId, readJson } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit";
import { requireUser } from "@/lib/auth/guard";
import { CAPTURE, EDIT } from "@/lib/auth/roles";
import { CaptureError, choiceOf, choiceOptions, measureTrace, readChoice } from "@/lib/capture";
import type { CaptureMeasurement } from "@/lib/capture";
import { buildLevels, replaceLevels } from "@/lib/field/capture-levels";
import {
  captureView,
  getCaptureContent,
  getCaptureRow,
  loadReadableCapture,
  traceOf,
} from "@/lib/field/captures";
import { choiceError } from "@/lib/field/upload";
import { readPlainNumber } from "@/lib/validation/plain-number";

export const POST = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Capture");
  const user = await requireUser({ roles: CAPTURE, req });
  const body = await readJson(req);
  if (typeof body !== "object" || body === null || Array.isArray(body))
    throw new ApiError("bad_request", "Send { channel, probe } as a JSON object.");
  const extra = Object.keys(body).filter((k) => k !== "channel" && k !== "probe");
  if (extra.length > 0)
    throw new ApiError(
      "bad_request",
      `Unknown field ${extra.map((k) => `"${k}"`).join(", ")}; send channel and probe.`,
    );
  // Strict numbers (as every JSON number field): a list, a boolean or hex text is a 400 naming the field.
  const raw = body as { channel?: unknown; probe?: unknown };
  const notNumbers = Object.fromEntries(
    (["channel", "probe"] as const)
      .filter(
        (k) => raw[k] !== undefined && raw[k] !== null && raw[k] !== "" && readPlainNumber(raw[k]) === null,
      )
      .map((k) => [
        k,
        `${k === "channel" ? "Channel" : "Probe attenuation"} is a plain number; got ${JSON.stringify(raw[k])}.`,
      ]),
  );
  if (Object.keys(notNumbers).length > 0)
    throw new ApiError("bad_request", Object.values(notNumbers).join(" "), notNumbers);
  const read = readChoice(raw);
  if (!read.ok) throw new ApiError("unprocessable", Object.values(read.fields).join(" "), read.fields);
  const row = await loadReadableCapture({ id, user });
  // Technicians change only their own uploads; engineers and admins any they read.
  if (!EDIT.includes(user.role) && row.uploadedBy !== user.id)
    throw new ApiError(
      "forbidden",
      "Only the technician who uploaded this capture, or an engineer, may change how it is measured.",
    );
  const before = choiceOf(row.measurement as CaptureMeasurement);
  const content = await getCaptureContent({ id });
  if (!content) throw new ApiError("not_found", "Capture was not found.");
  let measurement: CaptureMeasurement;
  let levels: ReturnType<typeof buildLevels>;
  try {
    // One parse with the new choice: the measurement and the stored zoom levels both come from it.
    const trace = await traceOf(content, choiceOptions(read.choice));
    measurement = measureTrace(trace);
    levels = buildLevels(id, trace.t, trace.v);
  } catch (e) {
    if (e instanceof CaptureError && e.code === "bad-choice") throw choiceError(e);
    if (e instanceof CaptureError)
      throw new ApiError("unprocessable", `With channel ${read.choice.channel}: ${e.message}.`, {
        channel: e.message,
      });
    throw e;
  }
  await db.transaction(async (tx) => {
    await tx.update(captures).set({ measurement }).where(eq(captures.id, id));
    await replaceLevels(tx, id, levels);
    await recordAudit(
      {
        actorId: user.id,
        action: "capture.remeasure",
        subjectType: "capture",
        subjectId: id,
        details: { before, after: read.choice },
      },
      tx,
    );
  });
  const updated = await getCaptureRow({ id });
  return Response.json({ capture: captureView(updated!) });
});
