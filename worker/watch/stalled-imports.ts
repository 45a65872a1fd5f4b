// Imports whose worker died: pg-boss 10 has no heartbeat of its own, so a job whose process was killed stays `active`
// until its expiry (queuePolicies.import, 15 min). The import handler beats on the import row instead; this watch,
// run by every worker, fails the job of a running import whose heartbeat has stopped, and pg-boss retries it.
import type PgBoss from "pg-boss";
import { pool } from "@/db";
import { env } from "@/lib/env";

/** How often the handler beats, and how often the watch looks (both well inside the stall threshold). */
export const heartbeatMs = () => Math.max(1_000, (env.IMPORT_STALL_SECONDS * 1000) / 6);
export const watchMs = () => Math.max(1_000, (env.IMPORT_STALL_SECONDS * 1000) / 2);

/** Marks the import as alive now, and again every heartbeatMs until the returned stop is called. */
export function beatWhileRunning(importId: string): () => void {
  const beat = () => pool.query("update imports set heartbeat_at = now() where id = $1", [importId]).catch(() => undefined);
  void beat();
  const timer = setInterval(beat, heartbeatMs());
  return () => clearInterval(timer);
}

type Stalled = { job_id: string; import_id: string; retry_count: number; retry_limit: number };

/**
 * Fails the pg-boss job of every running import whose heartbeat is older than IMPORT_STALL_SECONDS, so it is retried by
 * its policy. On the last allowed attempt the import itself is marked failed with a message (nothing of it was stored:
 * the dead worker's transaction was rolled back by PostgreSQL). Returns the import ids it acted on.
 */
export async function failStalledImports(boss: PgBoss): Promise<string[]> {
  const res = await pool.query<Stalled>(
    `select j.id as job_id, i.id as import_id, j.retry_count, j.retry_limit
     from pgboss.job j join imports i on i.id::text = j.data->>'importId'
     where j.name = 'import' and j.state = 'active' and i.status in ('pending', 'running')
       -- the job's own start counts too: a retry just fetched is not judged by its dead predecessor's last beat
       and greatest(i.heartbeat_at, i.started_at, j.started_on) < now() - make_interval(secs => $1)`,
    [env.IMPORT_STALL_SECONDS],
  );
  for (const s of res.rows) {
    const message = `The worker running this import stopped (no sign of life for ${env.IMPORT_STALL_SECONDS} s)`;
    await boss.fail("import", s.job_id, { message });
    if (s.retry_count >= s.retry_limit) {
      await pool.query(
        "update imports set status = 'failed', message = $2, finished_at = now() where id = $1 and status in ('pending', 'running')",
        [s.import_id, `${message} on every attempt; nothing was imported. Start the import again.`],
      );
    }
    console.error(`[worker] import ${s.import_id}: ${message}; ${s.retry_count < s.retry_limit ? "retrying" : "gave up"}`);
  }
  return res.rows.map((s) => s.import_id);
}
