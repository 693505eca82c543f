// GET the display trace of a capture: the stored min/max envelope of the whole
// record, or with ?fromS=&toS= a fresh envelope of that window re-read from the
// stored file, so zooming in shows real samples rather than a stretched envelope.
import { z } from "zod";
import { ApiError } from "@/lib/api/errors";
import { plainNumber } from "@/lib/validation/plain-number";
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import {
  choiceOf,
  choiceOptions,
  decimateEnvelope,
  parseCapture,
  PLOT_POINTS,
  type CaptureMeasurement,
} from "@/lib/capture";
import { getCaptureContent, loadReadableCapture } from "@/lib/field/captures";
import type { CapturePlot } from "@/lib/field/shapes";

const windowSchema = z
  .object({
    fromS: plainNumber("fromS is a time in seconds, written as a plain number"),
    toS: plainNumber("toS is a time in seconds, written as a plain number"),
  })
  .refine((w) => w.toS > w.fromS, { message: "toS must be later than fromS", path: ["toS"] });

/** First index whose time is >= t. */
function lowerBound(t: Float64Array, x: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (t[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
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
  if (wanted) {
    const content = await getCaptureContent({ id });
    if (!content) throw new ApiError("not_found", "Capture was not found.");
    const trace = await parseCapture(
      (async function* () {
        yield content;
      })(),
      // The channel and probe the measurement was made with.
      { ...choiceOptions(choiceOf(m)), maxBytes: content.length + 1 },
    );
    // One sample either side so the window's ends are drawn.
    const from = Math.max(0, lowerBound(trace.t, wanted.fromS) - 1);
    const to = Math.min(trace.t.length, lowerBound(trace.t, wanted.toS) + 1);
    points = decimateEnvelope(trace.t, trace.v, PLOT_POINTS, from, to);
    edges = m.edges.filter((e) => e.tS >= wanted.fromS && e.tS <= wanted.toS);
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
    window: wanted ? { fromS: wanted.fromS, toS: wanted.toS } : null,
  };
  return Response.json(body);
});
