// Shared bodies for the workspace API tests. Component values are demo data.
import { count, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { apiTokens, retrofits, revisionFiles, revisions, stages, targets } from "@/db/schema";
import { tokenClient } from "../../helpers/server";

export const UJT_STAGE = {
  kind: "ujt",
  supplyV: "20",
  timingR: "33k",
  timingC: "220n",
  eta: "0.65",
  tolerances: { timingR: "5", timingC: "10" },
};

export const TWO_TARGETS = [
  { device: "atmega328p", clockSource: "crystal", clockHz: "16M", mode: "pwm", requiredTolerancePct: 2 },
  { device: "stm32g031", clockSource: "hsi16", clockHz: "16M", mode: "pwm", requiredTolerancePct: 5 },
];

export function newRetrofitBody(name = `Test ${Math.random().toString(36).slice(2, 8)}`) {
  return {
    name,
    site: "Test Site",
    assetTag: `T-${Math.random().toString(36).slice(2, 8)}`,
    boardRef: "card 1, Q1",
    stage: UJT_STAGE,
    targets: TWO_TARGETS,
  };
}

/** Row counts of every table the workspace writes, limited to one user's
 *  rows so test files running in parallel do not disturb the comparison. */
export async function rowCounts(userId: number): Promise<Record<string, number>> {
  const mine = db.select({ id: retrofits.id }).from(retrofits).where(eq(retrofits.createdBy, userId));
  const myRevisions = db.select({ id: revisions.id }).from(revisions).where(eq(revisions.createdBy, userId));
  const n = async (q: Promise<{ n: number }[]>) => (await q)[0].n;
  return {
    retrofits: await n(db.select({ n: count() }).from(retrofits).where(eq(retrofits.createdBy, userId))),
    stages: await n(db.select({ n: count() }).from(stages).where(inArray(stages.retrofitId, mine))),
    targets: await n(db.select({ n: count() }).from(targets).where(inArray(targets.retrofitId, mine))),
    revisions: await n(db.select({ n: count() }).from(revisions).where(eq(revisions.createdBy, userId))),
    revisionFiles: await n(
      db.select({ n: count() }).from(revisionFiles).where(inArray(revisionFiles.revisionId, myRevisions)),
    ),
    apiTokens: await n(db.select({ n: count() }).from(apiTokens).where(eq(apiTokens.userId, userId))),
  };
}

export async function setRevisionState(id: number, state: "released" | "prepared") {
  await db.update(revisions).set({ state }).where(eq(revisions.id, id));
}

/** tokenClient with a body typed as any JSON value (stringified here). */
export function jsonClient(token: string) {
  const call = tokenClient(token);
  return (path: string, init: Omit<RequestInit, "body"> & { body?: unknown } = {}) => {
    const { body, ...rest } = init;
    return call(path, {
      ...rest,
      ...(body === undefined ? {} : { body: typeof body === "string" ? body : JSON.stringify(body) }),
    });
  };
}
export type JsonClient = ReturnType<typeof jsonClient>;
