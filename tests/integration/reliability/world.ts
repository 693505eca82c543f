// The objects the reliability tests act on: one user per role (unique to the
// test file, so counts scoped to them are not disturbed by files running in
// parallel), a signed-in session and an API token for each, a revoked token,
// and retrofits with revisions in every state made by the real generator.
import { createHash, randomBytes } from "node:crypto";
import { and, eq, inArray, or, sql } from "drizzle-orm";
import { db } from "@/db/client";
import {
  apiTokens,
  auditEvents,
  captures,
  comments,
  fieldCheckPhotos,
  fieldChecks,
  invitations,
  retrofits,
  reviews,
  revisions,
  stages,
  targets,
  users,
  type Role,
  type RevisionState,
} from "@/db/schema";
import { measureCsv } from "@/lib/capture";
import { insertCapture } from "@/lib/field/captures";
import { generateRevision } from "@/lib/revisions/generate";
import { signedIn, type Session } from "../../helpers/server";
import { solidPng } from "../../helpers/png";
import { makeToken, makeUser, TEST_PASSWORD } from "../../helpers/users";

export const ROLE_LIST: Role[] = ["admin", "engineer", "reviewer", "technician"];
export type Principal = Role | "signed-out" | "revoked-token";
export const PRINCIPALS: Principal[] = [...ROLE_LIST, "signed-out", "revoked-token"];

export type Actor = { id: number; email: string; role: Role; token: string; session: Session };

export type World = {
  tag: string;
  site: string;
  actors: Record<Role, Actor>;
  /** A second engineer: author of revisions that the first engineer did not make. */
  author: Actor;
  revokedToken: string;
  revokedUserId: number;
  userIds: number[];
  retrofitIds: number[];
  /** A retrofit with draft, in-review and approved revisions (by `author`). */
  retrofitId: number;
  revision: Record<"prepared" | "awaiting_check" | "released", number>;
  captureId: number;
  /** A field check on the released revision, recorded by the technician, with one line's photo. */
  fieldCheckId: number;
  photoId: number;
};

/** ATmega328P at 16 MHz, fast PWM: a 100 Hz, 20 % measured stage is exact
 *  (datasheet Timer/Counter1: f = fclk / (N * (1 + TOP)) = 16e6 / (8 * 20000)). */
export const STAGE = { kind: "measured", periodS: 10e-3, highS: 2e-3 } as const;
export const TARGET = {
  device: "atmega328p",
  clockSource: "crystal",
  clockHz: 16e6,
  mode: "pwm",
  requiredTolerancePct: 2,
} as const;

async function actor(role: Role, site: string | null): Promise<Actor> {
  const u = await makeUser(role, { site: site ?? undefined });
  const [session, token] = await Promise.all([signedIn(u.email, TEST_PASSWORD), makeToken(u.id)]);
  return { id: u.id, email: u.email, role, token, session };
}

export async function makeRetrofit(world: Pick<World, "tag" | "site" | "retrofitIds">, createdBy: number) {
  const tag = randomBytes(3).toString("hex");
  const [rf] = await db
    .insert(retrofits)
    .values({
      name: `Reliability ${world.tag} ${tag}`,
      site: world.site,
      assetTag: `RL-${tag}`,
      createdBy,
    })
    .returning();
  await db.insert(stages).values({ retrofitId: rf.id, kind: STAGE.kind, values: STAGE });
  await db.insert(targets).values({ retrofitId: rf.id, position: 0, ...TARGET });
  world.retrofitIds.push(rf.id);
  return rf;
}

export async function makeRevision(retrofitId: number, userId: number, state: RevisionState = "prepared") {
  const rev = await generateRevision({ retrofitId, userId });
  if (state !== "prepared") {
    await db
      .update(revisions)
      .set({ state, submittedAt: new Date(), decidedAt: state === "awaiting_check" ? null : new Date() })
      .where(eq(revisions.id, rev.id));
  }
  return rev;
}

/** A thread on a revision, for the resolve route. */
export async function makeComment(revisionId: number, authorId: number) {
  const [c] = await db
    .insert(comments)
    .values({ revisionId, authorId, body: "Check the prescaler." })
    .returning();
  return c;
}

/** A 100 Hz square wave export, 20 % high, 10 periods at 10 µs per sample. */
export function squareCsv(): string {
  const rows = ["Time (s),CH1 (V)"];
  for (let i = 0; i < 10_200; i++) {
    const k = (i - 100 + 1000) % 1000;
    rows.push(`${(i * 1e-5).toPrecision(10)},${i >= 100 && k < 200 ? 5 : 0}`);
  }
  return rows.join("\n") + "\n";
}

export async function makeWorld(): Promise<World> {
  const tag = randomBytes(3).toString("hex");
  const site = `Reliability site ${tag}`;
  const [admin, engineer, reviewer, technician, author] = await Promise.all([
    actor("admin", null),
    actor("engineer", null),
    actor("reviewer", null),
    actor("technician", site),
    actor("engineer", null),
  ]);
  // The strongest account with a revoked token: the token must open nothing.
  const revokedUser = await makeUser("admin");
  const revokedToken = await makeToken(revokedUser.id);
  await db.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.userId, revokedUser.id));

  const world: World = {
    tag,
    site,
    actors: { admin, engineer, reviewer, technician },
    author,
    revokedToken,
    revokedUserId: revokedUser.id,
    userIds: [admin.id, engineer.id, reviewer.id, technician.id, author.id, revokedUser.id],
    retrofitIds: [],
    retrofitId: 0,
    revision: { prepared: 0, awaiting_check: 0, released: 0 },
    captureId: 0,
    fieldCheckId: 0,
    photoId: 0,
  };
  const rf = await makeRetrofit(world, author.id);
  world.retrofitId = rf.id;
  world.revision.released = (await makeRevision(rf.id, author.id, "released")).id;
  world.revision.awaiting_check = (await makeRevision(rf.id, author.id, "awaiting_check")).id;
  world.revision.prepared = (await makeRevision(rf.id, author.id, "prepared")).id;

  world.captureId = await makeCapture(rf.id, technician.id);
  const [check] = await db
    .insert(fieldChecks)
    .values({
      revisionId: world.revision.released,
      technicianId: technician.id,
      measuredPeriodS: 10e-3,
      measuredHighS: 2e-3,
      lines: [],
      passed: true,
      signedOffBy: "A. Tester",
    })
    .returning({ id: fieldChecks.id });
  world.fieldCheckId = check.id;
  const photo = solidPng(4, 4, [200, 120, 40]);
  const [p] = await db
    .insert(fieldCheckPhotos)
    .values({
      fieldCheckId: check.id,
      stepId: "s1",
      mediaType: "image/png",
      content: photo,
      byteSize: photo.length,
      sha256: createHash("sha256").update(photo).digest("hex"),
    })
    .returning({ id: fieldCheckPhotos.id });
  world.photoId = p.id;
  return world;
}

export async function makeCapture(retrofitId: number | null, uploadedBy: number, fileName = "square.csv") {
  const csv = squareCsv();
  return insertCapture({
    retrofitId,
    uploadedBy,
    fileName,
    content: Buffer.from(csv),
    sha256: createHash("sha256").update(csv).digest("hex"),
    measurement: await measureCsv(csv),
  });
}

/** Everything a request could have changed in this world's objects and by its
 *  users. Token last-use times are left out: reading them is not a change. */
/**
 * Waits until no revision of these retrofits is still building: an accepted
 * generation answers 202 and its job finishes later on the worker, which
 * would otherwise change rows between two fingerprints.
 */
async function buildsSettled(retrofitIds: number[], timeoutMs = 180_000): Promise<void> {
  if (retrofitIds.length === 0) return;
  const until = Date.now() + timeoutMs;
  for (;;) {
    const [{ n }] = await db
      .select({ n: sql<number>`count(*)`.mapWith(Number) })
      .from(revisions)
      .where(and(inArray(revisions.retrofitId, retrofitIds), eq(revisions.buildState, "building")));
    if (n === 0) return;
    if (Date.now() > until) throw new Error(`${n} revision(s) still building after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export async function fingerprint(world: World): Promise<string> {
  const rfIds = world.retrofitIds;
  const uIds = world.userIds;
  const rfs = await db
    .select({
      id: retrofits.id,
      name: retrofits.name,
      updatedAt: retrofits.updatedAt,
      archivedAt: retrofits.archivedAt,
    })
    .from(retrofits)
    .where(or(inArray(retrofits.id, rfIds), inArray(retrofits.createdBy, uIds)))
    .orderBy(retrofits.id);
  const ids = rfs.map((r) => r.id);
  await buildsSettled(ids);
  const stg = await db.select().from(stages).where(inArray(stages.retrofitId, ids)).orderBy(stages.id);
  const tgt = await db.select().from(targets).where(inArray(targets.retrofitId, ids)).orderBy(targets.id);
  const revs = await db
    .select({
      id: revisions.id,
      state: revisions.state,
      number: revisions.number,
      decidedBy: revisions.decidedBy,
      submittedAt: revisions.submittedAt,
      supersededAt: revisions.supersededAt,
      sha: revisions.bundleSha256,
    })
    .from(revisions)
    .where(or(inArray(revisions.retrofitId, ids), inArray(revisions.createdBy, uIds)))
    .orderBy(revisions.id);
  const revIds = revs.map((r) => r.id).concat([0]);
  const count = async (q: Promise<{ n: number }[]>) => (await q)[0].n;
  const n = sql<number>`count(*)::int`;
  const counts = {
    comments: await count(
      db
        .select({ n })
        .from(comments)
        .where(or(inArray(comments.revisionId, revIds), inArray(comments.authorId, uIds))),
    ),
    reviews: await count(
      db
        .select({ n })
        .from(reviews)
        .where(or(inArray(reviews.revisionId, revIds), inArray(reviews.reviewerId, uIds))),
    ),
    fieldChecks: await count(
      db
        .select({ n })
        .from(fieldChecks)
        .where(or(inArray(fieldChecks.revisionId, revIds), inArray(fieldChecks.technicianId, uIds))),
    ),
    captures: await count(db.select({ n }).from(captures).where(inArray(captures.uploadedBy, uIds))),
    invitations: await count(db.select({ n }).from(invitations).where(inArray(invitations.invitedBy, uIds))),
    audit: await count(db.select({ n }).from(auditEvents).where(inArray(auditEvents.actorId, uIds))),
  };
  const capRows = await db
    .select({ id: captures.id, retrofitId: captures.retrofitId })
    .from(captures)
    .where(inArray(captures.uploadedBy, uIds))
    .orderBy(captures.id);
  const tokens = await db
    .select({ id: apiTokens.id, revokedAt: apiTokens.revokedAt, name: apiTokens.name })
    .from(apiTokens)
    .where(inArray(apiTokens.userId, uIds))
    .orderBy(apiTokens.id);
  const people = await db
    .select({ id: users.id, role: users.role, site: users.site, disabled: users.disabled })
    .from(users)
    .where(inArray(users.id, uIds))
    .orderBy(users.id);
  return JSON.stringify({ rfs, stg, tgt, revs, counts, capRows, tokens, people });
}
