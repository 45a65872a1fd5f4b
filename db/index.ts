import { drizzle } from "drizzle-orm/node-postgres";
import { Pool, type PoolClient, type QueryResult, type QueryResultRow } from "pg";
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

/** A plain pg client inside `pgTransaction`: the hot paths send named statements, which PostgreSQL plans once per connection. */
export type PgTx = PoolClient;

/** A named statement: the name must always go with the same text. */
export async function named<R extends QueryResultRow = QueryResultRow>(client: Pool | PoolClient, name: string, text: string, values: unknown[]): Promise<QueryResult<R>> {
  return client.query<R>({ name, text, values });
}

/**
 * One transaction on one pooled client, for the hot paths that use named statements (drizzle's transactions cannot name
 * theirs). Rolls back on any error; a client whose connection failed is discarded instead of returned to the pool.
 */
export async function pgTransaction<T>(fn: (client: PgTx) => Promise<T>): Promise<T> {
  const client = await pool.connect();
  let broken: Error | undefined;
  try {
    await client.query("begin");
    const result = await fn(client);
    await client.query("commit");
    return result;
  } catch (error) {
    await client.query("rollback").catch((e: Error) => (broken = e));
    throw error;
  } finally {
    client.release(broken);
  }
}
