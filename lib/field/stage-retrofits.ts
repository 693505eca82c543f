import "server-only";
// Retrofits a capture may become the measured stage of, for the picker on the
// capture page: the ones an engineer may edit (not archived). A capture tied
// to a retrofit only goes to that one (the use-as-stage route says 409).
import { asc, eq, isNull } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits } from "@/db/schema";

export type StageRetrofit = { id: number; name: string; assetTag: string; site: string };

export async function stageRetrofits(linkedTo: number | null): Promise<StageRetrofit[]> {
  const columns = {
    id: retrofits.id,
    name: retrofits.name,
    assetTag: retrofits.assetTag,
    site: retrofits.site,
  };
  return db
    .select(columns)
    .from(retrofits)
    .where(linkedTo === null ? isNull(retrofits.archivedAt) : eq(retrofits.id, linkedTo))
    .orderBy(asc(retrofits.site), asc(retrofits.name), asc(retrofits.id))
    .limit(500);
}
