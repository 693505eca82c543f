// GET the display trace of a capture: the stored min/max envelope of the whole
// record, or with ?fromS=&toS= the envelope of that window read from the
// capture's stored levels (lib/field/capture-levels.ts), so zooming in shows
// real samples without parsing the file again. A capture stored before the
// levels existed gets them on its first zoom (parsed once, then stored).
import { z } from "zod";
import { ApiError } from "@/lib/api/errors";
import { plainNumber } from "@/lib/validation/plain-number";
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { choiceOf, choiceOptions, type CaptureMeasurement } from "@/lib/capture";
import { db } from "@/db/client";
import { getCaptureContent, loadReadableCapture, traceOf } from "@/lib/field/captures";
import { buildLevels, hasLevels, readWindow, storeLevels } from "@/lib/field/capture-levels";
import type { CapturePlot } from "@/lib/field/shapes";

const windowSchema = z
  .object({
    fromS: plainNumber("fromS is a time in seconds, written as a plain number"),
    toS: plainNumber("toS is a time in seconds, written as a plain number"),
  })
  .refine((w) => w.toS > w.fromS, { message: "toS must be later than fromS", path: ["toS"] });

async function ensureLevels(id: number, m: CaptureMeasurement): Promise<void> {
  if (await hasLevels(id)) return;
  const content = await getCaptureContent({ id });
  if (!content) throw new ApiError("not_found", "Capture was not found.");
  // The channel and probe the measurement was made with.
  const trace = await traceOf(content, choiceOptions(choiceOf(m)));
  await db.transaction((tx) => storeLevels(tx, buildLevels(id, trace.t, trace.v)));
}

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Capture");
  const q = new URL(req.url).searchParams;
  const wanted =
    q.has("fromS") || q.has("toS") ? windowSchema.parse({ fromS: q.get("fromS"), toS: q.get("toS") }) : null;
  const user = await requireUser({ roles: ANY, req });
  const row = await loadReadableCapture({ id, user });
  const m = row.measurement as CaptureMeasurement;

  let points = m.plot;
  let edges = m.edges;
  let window: CapturePlot["window"] = null;
  if (wanted) {
    await ensureLevels(id, m);
    const read = await readWindow(id, wanted.fromS, wanted.toS);
    points = read.points;
    edges = m.edges.filter((e) => e.tS >= wanted.fromS && e.tS <= wanted.toS);
    window = {
      fromS: wanted.fromS,
      toS: wanted.toS,
      samplesPerEntry: read.samplesPerEntry,
      untilS: read.untilS,
    };
  }
  const body: CapturePlot = {
    captureId: id,
    lowLevelV: m.lowLevelV,
    highLevelV: m.highLevelV,
    referenceV: m.referenceV,
    startS: m.startS,
    durationS: m.durationS,
    points,
    edges,
    edgesTotal: m.edgesTotal,
    window,
  };
  return Response.json(body);
});
