// The worker killed (SIGKILL) in the middle of an import: pg-boss retries the job once a new worker runs; no item twice.
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
// A handle on the queue for maintenance only (no workers, no supervision of its own).
let boss: PgBoss;

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
  const killed = await killWorker("SIGKILL");

  // The killed worker's transaction is rolled back by PostgreSQL: nothing of the import is visible.
  await sleep(500);
  expect(await itemCounts(w.project.id)).toEqual({ n: 0, distinct: 0 });
  const orphan = await importJob(importId);
  expect(orphan?.state).toBe("active");
  expect(orphan?.retry_limit).toBe(queuePolicies.import.retryLimit);
  expect(orphan?.expire_s).toBe(queuePolicies.import.expireInSeconds);

  // pg-boss 10 has no heartbeat: a dead worker's job is retried once it has been active for expire_in (queuePolicies.import,
  // 3600 s) and a supervisor's maintenance (every 120 s) expires it. That hour is skipped here by moving the job's start back.
  await pool.query("update pgboss.job set started_on = now() - expire_in - interval '1 second' where id = $1", [orphan!.id]);
  await boss.maintain();
  const retried = await importJob(importId);
  expect(retried?.state).toBe("retry");

  const pid = await startWorker();
  expect(pid).not.toBe(killed);
  const done = await waitForImport(importId, (r) => !["pending", "running"].includes(r.status), 45_000);
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
}, 90_000);
