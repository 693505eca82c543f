// Set-up for the field tests: retrofits and revisions made through the real
// generator, then moved to the state a test needs; synthetic scope exports.
import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { retrofits, revisions, stages, targets, type RevisionState } from "@/db/schema";
import { generateRevision } from "@/lib/revisions/generate";

/** A 100 Hz, 20 % duty measured stage on an ATmega328P with a 16 MHz crystal in
 *  fast PWM. ATmega328P datasheet, Timer/Counter1 fast PWM: f = fclk / (N * (1 + TOP)), so
 *  16 MHz / (8 * 20000) = 100 Hz is reachable exactly. */
export const STAGE = { kind: "measured", periodS: 10e-3, highS: 2e-3 } as const;

export async function makeRetrofit(opts: { createdBy: number; site?: string }) {
  const tag = randomBytes(3).toString("hex");
  const [r] = await db
    .insert(retrofits)
    .values({
      name: `Field test pump clock ${tag}`,
      site: opts.site ?? "Test Site North",
      assetTag: `T-${tag}`,
      boardRef: "test board",
      createdBy: opts.createdBy,
    })
    .returning();
  await db.insert(stages).values({ retrofitId: r.id, kind: STAGE.kind, values: STAGE });
  await db.insert(targets).values({
    retrofitId: r.id,
    position: 0,
    device: "atmega328p",
    clockSource: "crystal",
    clockHz: 16e6,
    mode: "pwm",
  });
  return r;
}

export async function makeRevision(opts: { retrofitId: number; userId: number; state: RevisionState }) {
  const rev = await generateRevision({ retrofitId: opts.retrofitId, userId: opts.userId });
  if (opts.state !== "prepared") {
    await db
      .update(revisions)
      .set({ state: opts.state, decidedAt: new Date() })
      .where(eq(revisions.id, rev.id));
  }
  return { ...rev, state: opts.state };
}

/** A square wave export: time in s, one voltage column, whole samples per level. */
export function squareCsv(opts: {
  periodS: number;
  highS: number;
  dtS: number;
  periods: number;
  highV?: number;
}) {
  const perPeriod = Math.round(opts.periodS / opts.dtS);
  const high = Math.round(opts.highS / opts.dtS);
  const rows = ["Time (s),CH1 (V)"];
  // Start low so the first rising edge is inside the record.
  const delay = Math.round(perPeriod / 10);
  const n = perPeriod * opts.periods + 2 * delay;
  for (let i = 0; i < n; i++) {
    const k = (i - delay + perPeriod) % perPeriod;
    const v = i >= delay && k < high ? (opts.highV ?? 5) : 0;
    rows.push(`${(i * opts.dtS).toPrecision(12)},${v}`);
  }
  return rows.join("\n") + "\n";
}
