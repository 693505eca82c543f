// GET one capture: file facts and the measurement summary (the trace for the
// plot comes from ./plot). DELETE: the uploader or an admin removes a capture
// no field check cites (409 naming the checks otherwise); audited.
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { captureView, deleteCapture, loadReadableCapture } from "@/lib/field/captures";

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Capture");
  const user = await requireUser({ roles: ANY, req });
  const row = await loadReadableCapture({ id, user });
  return Response.json({ capture: captureView(row) });
});

export const DELETE = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Capture");
  const user = await requireUser({ roles: ANY, req });
  return Response.json({ deleted: await deleteCapture({ id, user }) });
});
