import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

// One pool per server process (kept on globalThis so dev reloads reuse it).
const globalForDb = globalThis as unknown as { clockgraftPool?: Pool };

function pool(): Pool {
  if (!globalForDb.clockgraftPool) {
    const p = new Pool({ connectionString: env().DATABASE_URL, max: 10, connectionTimeoutMillis: 5000 });
    // A dropped connection (server restart) must not crash the process; the
    // pool replaces it on the next query.
    p.on("error", (err) => console.error("database pool error:", err.message));
    // A client checked out of the pool (inside a transaction, between two of its
    // queries) gets no pool listener: a server restart at that moment emitted an
    // unhandled 'error' and took the whole worker down. Each client gets its own
    // listener; its next query then fails and the transaction rolls back (the job
    // is retried), and the pool drops the broken client when it is released.
    p.on("connect", (client) =>
      client.on("error", (err) => console.error("database client error:", err.message)),
    );
    globalForDb.clockgraftPool = p;
  }
  return globalForDb.clockgraftPool;
}

export const db = drizzle({ client: pool(), schema });
export type Db = typeof db;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
