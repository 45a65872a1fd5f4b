// The worker's watch for imports whose worker died (worker/watch/stalled-imports.ts), against the real queue tables:
// a silent import's job is failed (so pg-boss retries it), a beating one is left alone, and on the last attempt the
// import itself is marked failed. The jobs are written as a dead worker leaves them: `active`, started long ago.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { imports } from "@/db/schema";
import { env } from "@/lib/env";
import { makeProject } from "@/tests/support/fixtures";
import { failStalledImports } from "@/worker/watch/stalled-imports";

let boss: PgBoss;
let projectId: number;

beforeAll(async () => {
  boss = new PgBoss({ connectionString: env.DATABASE_URL, schema: "pgboss", max: 2, supervise: false, schedule: false, migrate: false });
  boss.on("error", () => undefined);
  await boss.start();
  projectId = (await makeProject()).project.id;
});
afterAll(async () => {
  await boss.stop({ graceful: false, wait: true }).catch(() => undefined);
  await pool.end();
});

/** A running import and its `active` job, as a worker leaves them; `silentFor` seconds since its last heartbeat. (A retry would wait an hour: no worker picks it up during the test.) */
async function orphan(silentFor: number, retry: { count: number; limit: number }) {
  const [imp] = await db
    .insert(imports)
    .values({ projectId, uploadIds: [], format: "csv", status: "running", startedAt: new Date(Date.now() - 3_600_000), heartbeatAt: new Date(Date.now() - silentFor * 1000) })
    .returning();
  const jobId = randomUUID();
  await pool.query(
    `insert into pgboss.job (id, name, data, state, retry_limit, retry_count, retry_delay, started_on)
     values ($1, 'import', $2, 'active', $3, $4, 3600, now() - interval '1 hour')`,
    [jobId, JSON.stringify({ importId: imp.id }), retry.limit, retry.count],
  );
  return { importId: imp.id, jobId };
}

const jobState = async (id: string) => (await pool.query("select state from pgboss.job where id = $1", [id])).rows[0]?.state as string | undefined;
const importRow = async (id: string) => (await db.select().from(imports).where(eq(imports.id, id)))[0];

describe("stalled-import watch", () => {
  it("fails the job of a silent import so it is retried, and leaves a beating one alone", async () => {
    const silent = await orphan(env.IMPORT_STALL_SECONDS + 30, { count: 0, limit: 3 });
    const beating = await orphan(1, { count: 0, limit: 3 });
    const acted = await failStalledImports(boss);
    expect(acted).toContain(silent.importId);
    expect(acted).not.toContain(beating.importId);
    expect(await jobState(silent.jobId)).toBe("retry");
    expect(await jobState(beating.jobId)).toBe("active");
    // The import waits for its retry, still running (the retry's first step resets it).
    expect((await importRow(silent.importId)).status).toBe("running");
  });

  it("on the last allowed attempt, marks the import failed with a message", async () => {
    const last = await orphan(env.IMPORT_STALL_SECONDS + 30, { count: 3, limit: 3 });
    expect(await failStalledImports(boss)).toContain(last.importId);
    expect(await jobState(last.jobId)).toBe("failed");
    const row = await importRow(last.importId);
    expect(row.status).toBe("failed");
    expect(row.message).toMatch(/stopped .* on every attempt; nothing was imported/);
  });
});
