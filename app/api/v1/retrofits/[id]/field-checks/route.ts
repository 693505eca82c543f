// GET the field history of a retrofit: every check, newest first. Technicians
// see checks of the approved revisions of their site only.
import { ApiError } from "@/lib/api/errors";
import { apiRoute, parseId } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { getRetrofit, listFieldChecks, technicianSeesRetrofit } from "@/lib/field/queries";

export const GET = apiRoute<{ id: string }>(async (req, ctx) => {
  const id = parseId((await ctx.params).id, "Retrofit");
  const user = await requireUser({ roles: ANY, req });
  const retrofit = await getRetrofit({ id });
  const visible =
    retrofit && (user.role !== "technician" || (await technicianSeesRetrofit({ user, retrofitId: id })));
  if (!visible) throw new ApiError("not_found", "Retrofit was not found.");
  const checks = await listFieldChecks({ user, retrofitId: id });
  return Response.json({
    retrofit: { id: retrofit.id, name: retrofit.name, site: retrofit.site, assetTag: retrofit.assetTag },
    checks,
  });
});
