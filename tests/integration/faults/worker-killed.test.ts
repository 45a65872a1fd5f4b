// The worker killed (SIGKILL) in the middle of an import: the import's heartbeat stops, a live worker's watch fails the
// job, pg-boss retries it, and every row is stored once.
import PgBoss from "pg-boss";
import { afterAll, beforeAll, expect, it } from "vitest";
import { pool } from "@/db";
import { env } from "@/lib/env";
import { queuePolicies } from "@/lib/jobs/queues";
import { api } from "@/tests/support/http";
import { makeRoleWorld } from "@/tests/support/fixtures";
import { killWorker, sleep, startWorker, workerPid } from "@/tests/support/cluster";
import { columnRoles, generatedCsv, itemCounts, putUpload, waitForImport } from "./helpers";

let w: Awaited<ReturnType<typeof makeRoleWorld>>;
// A handle on the queue for looking at jobs only (no workers, no supervision of its own).
let boss: PgBoss;
// The restarted worker judges an import dead after 5 s without a heartbeat (the default is 120 s).
const STALL_SECONDS = 5;

beforeAll(async () => {
  w = await makeRoleWorld();
  boss = new PgBoss({ connectionString: env.DATABASE_URL, schema: "pgboss", max: 2, supervise: false, schedule: false, migrate: false });
  boss.on("error", () => undefined);
  await boss.start();
});

afterAll(async () => {
  await boss.stop({ graceful: false, wait: true }).catch(() => undefined);
  // Later suites need a worker.
  if (workerPid() == null) await startWorker();
});

async function importJob(importId: string) {
  const res = await pool.query("select id, state, retry_count, retry_limit, extract(epoch from expire_in)::int as expire_s from pgboss.job where name = 'import' and data->>'importId' = $1", [importId]);
  return res.rows[0] as { id: string; state: string; retry_count: number; retry_limit: number; expire_s: number } | undefined;
}

it("retries the import after the worker is killed mid-import and stores each row once", async () => {
  const rows = 300_000;
  const upload = await putUpload(w.project.id, "killed.csv", generatedCsv(rows, 23));
  const started = await api(`/api/v1/projects/${w.project.id}/imports`, { token: w.tokens.owner.secret, body: { uploadIds: [upload.id], format: "csv", columns: columnRoles } });
  expect(started.status, started.text).toBe(202);
  const importId = started.json.import.id as string;
  const running = await waitForImport(importId, (r) => r.status !== "pending" && (r.rowsDone > 0 || r.status !== "running"));
  expect(running.status, "the worker must die while the import runs").toBe("running");
  const beat = await pool.query("select heartbeat_at from imports where id = $1", [importId]);
  expect(beat.rows[0].heartbeat_at, "the running import beats").not.toBeNull();
  const killed = await killWorker("SIGKILL");
  const killedAt = Date.now();

  // The killed worker's transaction is rolled back by PostgreSQL: nothing of the import is visible.
  await sleep(500);
  expect(await itemCounts(w.project.id)).toEqual({ n: 0, distinct: 0 });
  const orphan = await importJob(importId);
  expect(orphan?.state).toBe("active");
  expect(orphan?.retry_limit).toBe(queuePolicies.import.retryLimit);
  expect(orphan?.expire_s).toBe(queuePolicies.import.expireInSeconds);

  // A new worker's watch finds the running import silent for STALL_SECONDS and fails its job; pg-boss retries it.
  const pid = await startWorker(45_000, { IMPORT_STALL_SECONDS: String(STALL_SECONDS) });
  expect(pid).not.toBe(killed);
  const done = await waitForImport(importId, (r) => !["pending", "running"].includes(r.status), 75_000);
  const retriedAfterS = (Date.now() - killedAt) / 1000;
  console.log(`[faults] killed import done ${retriedAfterS.toFixed(1)} s after the kill (stall threshold ${STALL_SECONDS} s)`);
  // Far sooner than the job's expiry, which is what retried it before there was a watch.
  expect(retriedAfterS).toBeLessThan(queuePolicies.import.expireInSeconds / 3);
  expect(done.status, done.message ?? "").toBe("succeeded");
  expect(done.itemsCreated).toBe(rows);
  expect(await itemCounts(w.project.id)).toEqual({ n: rows, distinct: rows });
  const jobId = orphan!.id;
  for (let i = 0; i < 50 && (await boss.getJobById("import", jobId, { includeArchive: true }))?.state !== "completed"; i += 1) await sleep(100);
  const finished = await boss.getJobById("import", jobId, { includeArchive: true });
  expect(finished?.state).toBe("completed");
  expect(finished?.retryCount, "completed on its first retry").toBe(1);

  // Running the finished job once more (as a duplicate delivery would) adds nothing.
  const again = await boss.send("import", { importId }, queuePolicies.import);
  for (let i = 0; i < 100; i += 1) {
    const job = await boss.getJobById("import", again!, { includeArchive: true });
    if (job?.state === "completed") break;
    await sleep(100);
  }
  expect((await boss.getJobById("import", again!, { includeArchive: true }))?.state).toBe("completed");
  expect(await itemCounts(w.project.id)).toEqual({ n: rows, distinct: rows });
}, 150_000);
