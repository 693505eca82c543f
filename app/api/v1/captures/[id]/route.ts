// GET one capture: file facts and the measurement summary (the trace for the
// plot comes from ./plot).
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { captureView, loadReadableCapture } from "@/lib/field/captures";

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Capture");
  const user = await requireUser({ roles: ANY, req });
  const row = await loadReadableCapture({ id, user });
  return Response.json({ capture: captureView(row) });
});
