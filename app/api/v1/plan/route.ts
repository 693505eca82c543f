// POST /api/v1/plan: stateless compute. Stage + targets in, analysis and one
// plan (or a reason) per target out; nothing is stored.
import { apiRoute, readJson } from "@/lib/api/route";
import { requireUser } from "@/lib/auth/guard";
import { ANY } from "@/lib/auth/roles";
import { analyzeStage } from "@/lib/engine";
import { planTargets, snapshotOf } from "@/lib/revisions/plan-targets";
import { planBodySchema } from "@/lib/validation/workspace";

export const POST = apiRoute(async (req) => {
  const body = planBodySchema.parse(await readJson(req));
  await requireUser({ roles: ANY, req });
  const analysis = analyzeStage(body.stage);
  const plans = planTargets(analysis, body.targets.map(snapshotOf));
  return Response.json({ stage: body.stage, analysis, plans });
});
