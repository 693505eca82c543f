// POST: upload a scope capture (multipart "file" or a raw CSV/TSV body),
// measured while it streams in and stored only once the measurement succeeds;
// ?channel=N (1-based voltage column) and ?probe=1|10|100 choose what is measured.
// GET: captures the caller may read, optionally of one retrofit.
import { ApiError } from "@/lib/api/errors";
import { choiceOptions, readChoice } from "@/lib/capture";
import { apiRoute, parseId } from "@/lib/api/route";
import { recordAudit } from "@/lib/audit";
import { requireUser } from "@/lib/auth/guard";
import { CAPTURE } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import { getCaptureRow, insertCapture, listCaptures, captureView } from "@/lib/field/captures";
import { getRetrofit, technicianSeesRetrofit } from "@/lib/field/queries";
import { readCaptureUpload } from "@/lib/field/upload";
import { checkCaptureQuota } from "@/lib/field/capture-quotas";

function retrofitParam(req: Request): number | null {
  const raw = new URL(req.url).searchParams.get("retrofitId");
  return raw ? parseId(raw, "Retrofit") : null;
}

export const POST = apiRoute(
  async (req) => {
    const retrofitId = retrofitParam(req);
    const user = await requireUser({ roles: CAPTURE, req });
    const q = new URL(req.url).searchParams;
    const choice = readChoice({ channel: q.get("channel"), probe: q.get("probe") });
    if (!choice.ok) throw new ApiError("bad_request", Object.values(choice.fields).join(" "), choice.fields);
    if (retrofitId !== null) {
      const retrofit = await getRetrofit({ id: retrofitId });
      const visible =
        retrofit && (user.role !== "technician" || (await technicianSeesRetrofit({ user, retrofitId })));
      if (!visible) throw new ApiError("not_found", "Retrofit was not found.");
    }
    // Refused before the body is read when the quota is already used up
    // (checked again, under a lock, when the capture is stored).
    // A raw body's length is the file's; a form's also counts its own parts.
    const declared = Number(req.headers.get("content-length") ?? "0");
    const raw = !/^multipart\//i.test(req.headers.get("content-type") ?? "");
    await checkCaptureQuota({
      uploadedBy: user.id,
      retrofitId,
      bytes: raw && Number.isFinite(declared) ? declared : 0,
    });
    const upload = await readCaptureUpload(req, env().CAPTURE_MAX_BYTES, choiceOptions(choice.choice));
    const id = await insertCapture({
      retrofitId,
      uploadedBy: user.id,
      fileName: upload.fileName,
      content: upload.content,
      sha256: upload.sha256,
      measurement: upload.measurement,
      trace: upload.trace,
    });
    await recordAudit({
      actorId: user.id,
      action: "capture.upload",
      subjectType: "capture",
      subjectId: id,
      details: {
        fileName: upload.fileName,
        byteSize: upload.content.length,
        sha256: upload.sha256,
        retrofitId,
      },
    });
    const row = await getCaptureRow({ id });
    return Response.json({ capture: captureView(row!) }, { status: 201 });
  },
  { bodyTypes: ["multipart/form-data", "text/csv", "text/tab-separated-values"] },
);

export const GET = apiRoute(async (req) => {
  const retrofitId = retrofitParam(req);
  const user = await requireUser({ roles: ["admin", "engineer", "reviewer", "technician"], req });
  const captures = await listCaptures({ user, retrofitId: retrofitId ?? undefined });
  return Response.json({ captures });
});
