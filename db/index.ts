import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

const globalForDb = globalThis as unknown as { vicinalPool?: Pool };

export const pool =
  globalForDb.vicinalPool ??
  new Pool({ connectionString: env.DATABASE_URL, max: env.DATABASE_POOL_MAX, connectionTimeoutMillis: 5_000 });
// An idle client losing its server (e.g. PostgreSQL restarting) must not crash the process.
pool.on("error", () => {});
globalForDb.vicinalPool = pool;

export const db = drizzle(pool, { schema });
export type Db = typeof db;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type DbOrTx = Db | Tx;
