import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";
import { getServerEnv } from "@/modules/platform/env";

export type Db = NodePgDatabase<typeof schema>;

// One pool per process. Kept on globalThis so development reloads reuse it.
const holder = globalThis as unknown as { __plinthPool?: pg.Pool; __plinthDb?: Db };

export function getPool(): pg.Pool {
  if (!holder.__plinthPool) {
    const pool = new pg.Pool({
      connectionString: getServerEnv().DATABASE_URL,
      max: 10,
      idleTimeoutMillis: 30_000,
      connectionTimeoutMillis: 5_000,
    });
    // A dropped connection (database restart) must not crash the process;
    // the pool replaces it on the next checkout.
    pool.on("error", (err) => console.error("[db] idle client error:", err.message));
    holder.__plinthPool = pool;
  }
  return holder.__plinthPool;
}

export function getDb(): Db {
  if (!holder.__plinthDb) holder.__plinthDb = drizzle(getPool(), { schema });
  return holder.__plinthDb;
}

export async function closeDb(): Promise<void> {
  const pool = holder.__plinthPool;
  holder.__plinthPool = undefined;
  holder.__plinthDb = undefined;
  if (pool) await pool.end();
}
