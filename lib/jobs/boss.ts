// One pg-boss instance per process, on the product's own database (schema
// "pgboss"). The web server only sends jobs and reads their state; workers
// (scripts/worker.ts) fetch and run them.
import PgBoss from "pg-boss";
import { sql, type SQL } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { env } from "@/lib/env";
import { QUEUES, queueOptions, type QueueName } from "./queues";

const globalForBoss = globalThis as unknown as { clockgraftBoss?: Promise<PgBoss> };

/** Maintenance every few seconds, so a job lost with its worker is retried soon after its expiry. */
function maintenanceSeconds(): number {
  const v = Number(process.env.CLOCKGRAFT_JOB_MAINTENANCE_SECONDS);
  return Number.isFinite(v) && v >= 1 ? v : 5;
}

export function boss(): Promise<PgBoss> {
  globalForBoss.clockgraftBoss ??= (async () => {
    const b = new PgBoss({
      connectionString: env().DATABASE_URL,
      max: 4,
      maintenanceIntervalSeconds: maintenanceSeconds(),
      // The web process needs no cron clock; schedules are not used.
      schedule: false,
    });
    // A dropped connection (database restart) is logged; pg-boss reconnects.
    b.on("error", (err) => console.error("job queue error:", err.message));
    await b.start();
    for (const name of Object.values(QUEUES)) {
      await b.createQueue(name, { name, ...queueOptions(name) });
    }
    return b;
  })().catch((err) => {
    globalForBoss.clockgraftBoss = undefined;
    throw err;
  });
  return globalForBoss.clockgraftBoss;
}

export async function stopBoss(): Promise<void> {
  const b = globalForBoss.clockgraftBoss;
  globalForBoss.clockgraftBoss = undefined;
  if (b) await (await b).stop({ graceful: true, wait: true });
}

/** pg-boss writes "$1"-style SQL; this turns it into a drizzle query on our transaction. */
function drizzleQuery(text: string, values: unknown[]): SQL {
  const parts = text.split(/\$(\d+)/);
  const chunks: SQL[] = [];
  // sql.param, not ${value}: drizzle would expand an array value into a list and break a cast.
  parts.forEach((p, i) => chunks.push(i % 2 === 0 ? sql.raw(p) : sql`${sql.param(values[Number(p) - 1])}`));
  return sql.join(chunks, sql.raw(""));
}

/**
 * Sends a job in the caller's transaction: it exists exactly when the action
 * that caused it commits (a mail for a decision, never one without the other).
 */
export async function sendJob(name: QueueName, data: object, tx?: Tx): Promise<string> {
  const b = await boss();
  const id = await b.send(name, data, {
    ...queueOptions(name),
    ...(tx
      ? {
          db: {
            executeSql: async (text: string, values: unknown[]) => {
              const r = await tx.execute(drizzleQuery(text, values));
              return { rows: r.rows as unknown[] };
            },
          },
        }
      : {}),
  });
  if (!id) throw new Error(`The job queue refused a ${name} job.`);
  return id;
}
