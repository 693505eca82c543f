// Seeds the demo scenario (db/seed/demo-data.ts). Idempotent: it does nothing
// when the demo users exist already.
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits, stages, targets, users } from "@/db/schema";
import { DEMO_RETROFITS, DEMO_USERS } from "@/db/seed/demo-data";
import { hashPassword } from "@/lib/auth/password";

const [existing] = await db.select().from(users).where(eq(users.email, DEMO_USERS[0].email));
if (existing) {
  console.log("demo data present; nothing to seed");
  process.exit(0);
}

const ids: Record<string, number> = {};
for (const u of DEMO_USERS) {
  const [row] = await db
    .insert(users)
    .values({ email: u.email, name: u.name, role: u.role, site: u.site ?? null, passwordHash: await hashPassword(u.password) })
    .returning();
  ids[u.role] = row.id;
}

for (const r of DEMO_RETROFITS) {
  const [row] = await db
    .insert(retrofits)
    .values({
      name: r.name,
      site: r.site,
      assetTag: r.assetTag,
      boardRef: r.boardRef,
      description: r.description,
      mainsPowered: r.mainsPowered,
      drivesThyristor: r.drivesThyristor,
      createdBy: ids.engineer,
    })
    .returning();
  await db.insert(stages).values({ retrofitId: row.id, kind: r.stage.kind, values: r.stage });
  await db.insert(targets).values(
    r.targets.map((t, i) => ({
      retrofitId: row.id,
      position: i,
      device: t.device,
      clockSource: t.clockSource,
      clockHz: t.clockHz,
      mode: t.mode ?? null,
      timer: t.timer ?? null,
      requiredTolerancePct: t.requiredTolerancePct ?? null,
    })),
  );
}
console.log(`seeded ${DEMO_USERS.length} users and ${DEMO_RETROFITS.length} retrofits`);
process.exit(0);
