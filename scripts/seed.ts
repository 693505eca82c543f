// Seeds the demo scenario (db/seed/demo-data.ts). Idempotent: it does nothing
// when the demo users exist already.
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits, revisions, stages, targets, users } from "@/db/schema";
import { DEMO_RETROFITS, DEMO_USERS } from "@/db/seed/demo-data";
import { hashPassword } from "@/lib/auth/password";
import { generateRevision } from "@/lib/revisions/generate";

const [existing] = await db.select().from(users).where(eq(users.email, DEMO_USERS[0].email));
if (existing) {
  console.log("demo data present; nothing to seed");
  process.exit(0);
}

const ids: Record<string, number> = {};
for (const u of DEMO_USERS) {
  const [row] = await db
    .insert(users)
    .values({
      email: u.email,
      name: u.name,
      role: u.role,
      site: u.site ?? null,
      passwordHash: await hashPassword(u.password),
    })
    .returning();
  ids[u.role] = row.id;
}

const retrofitIds: Record<string, number> = {};
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
  retrofitIds[r.assetTag] = row.id;
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
      trigger: t.trigger ?? null,
    })),
  );
}
// r1 of every retrofit, generated exactly as the app does it (engine, files,
// zip, sha256, one transaction).
const r1: Record<string, number> = {};
for (const r of DEMO_RETROFITS) {
  const rev = await generateRevision({
    retrofitId: retrofitIds[r.assetTag],
    userId: ids.engineer,
    note: "first cut",
  });
  r1[r.assetTag] = rev.id;
}

// Demo shortcut, not the review flow: the sump heater and the beacon r1 are
// set to approved directly so the field pages have bundles to show. Real
// approvals go through the review pages (submit, reviewer decision, audit).
for (const tag of ["KL-HTR-03", "MH-BCN-01"]) {
  const now = new Date();
  await db
    .update(revisions)
    .set({ state: "released", submittedAt: now, decidedBy: ids.reviewer, decidedAt: now })
    .where(eq(revisions.id, r1[tag]));
}
console.log(`seeded ${DEMO_USERS.length} users, ${DEMO_RETROFITS.length} retrofits and their r1 revisions`);
process.exit(0);
