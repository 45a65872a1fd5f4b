// PostgreSQL stopped and started again in the middle of a labelling burst against the running app.
import { randomUUID } from "node:crypto";
import { and, inArray, isNull } from "drizzle-orm";
import { afterAll, expect, it } from "vitest";
import { db } from "@/db";
import { labels } from "@/db/schema";
import { api } from "@/tests/support/http";
import { portOpen, pgPort, sleep, startPostgres, startWorker, stopPostgres, workerPid } from "@/tests/support/cluster";
import { makeLabellingWorld, member } from "../labelling/world";

type Seen = { at: number; step: string; status: number; code?: string };
const seen: Seen[] = [];
const acknowledged = new Set<string>();
let stopping = false;

afterAll(async () => {
  // Whatever happened above, later test files need the database.
  if (!(await portOpen(pgPort))) await startPostgres();
  // pg-boss 10 can reject outside any handler when the database goes away under a running job, which ends the
  // worker process (seen in worker logs); later suites need one.
  if (workerPid() == null) {
    console.log("[faults] the worker died during the PostgreSQL restart; starting a new one");
    await startWorker();
  }
});

async function call(step: string, path: string, token: string, body?: unknown) {
  try {
    const r = await api(path, { token, method: "POST", body });
    seen.push({ at: Date.now(), step, status: r.status, code: r.json?.error?.code });
    return r;
  } catch (error) {
    seen.push({ at: Date.now(), step, status: 0, code: (error as Error).message });
    return null;
  }
}

/** One annotator: lease, then label with one clientSubmissionId, retried until the server answers 2xx or refuses it. */
async function annotator(projectId: number, token: string, classIds: number[]) {
  while (!stopping) {
    const lease = await call("lease", `/api/v1/projects/${projectId}/desk/next`, token, {});
    const item = lease?.status === 200 ? lease.json.data : null;
    if (!item) {
      await sleep(100);
      continue;
    }
    const submission = randomUUID();
    const body = { clientSubmissionId: submission, classId: classIds[item.itemId % classIds.length], suggestionToken: item.suggestionToken };
    for (;;) {
      const r = await call("label", `/api/v1/projects/${projectId}/items/${item.itemId}/labels`, token, body);
      if (r && r.status >= 200 && r.status < 300) {
        acknowledged.add(submission);
        break;
      }
      if (r && r.status !== 503) break;
      await sleep(200);
    }
  }
}

it("answers 503 unavailable:database while PostgreSQL is down, never 500, recovers by itself and loses no acknowledged label", async () => {
  const team = await Promise.all(Array.from({ length: 6 }, (_, i) => member("annotator", `burst ${i}`)));
  const world = await makeLabellingWorld({ n: 3_000, members: team, settings: { overlap: 2 } });
  const classIds = world.classes.map((c) => c.id);
  const burst = Promise.all(team.map((m) => annotator(world.project.id, m.token, classIds)));

  // The burst is under way once a few labels are acknowledged (a loaded machine can take a while).
  for (let i = 0; i < 300 && acknowledged.size < 6; i += 1) await sleep(100);
  const before = acknowledged.size;
  await stopPostgres();
  const downAt = Date.now();
  await sleep(2_500);
  await startPostgres();
  const upAt = Date.now();
  // Keep labelling until a label has been acknowledged after the restart, or 20 s.
  const ackAtUp = acknowledged.size;
  const until = Date.now() + 20_000;
  while (acknowledged.size <= ackAtUp && Date.now() < until) await sleep(100);
  const recoveredAt = Date.now();
  await sleep(1_500);
  stopping = true;
  await burst;

  const during = seen.filter((s) => s.at > downAt && s.at < upAt);
  const statuses = [...new Set(seen.map((s) => `${s.step} ${s.status} ${s.code ?? ""}`.trim()))].sort();
  console.log(`[faults] ${seen.length} requests; acknowledged ${before} before the stop, ${acknowledged.size} in all; recovered ${recoveredAt - upAt} ms after the start; statuses: ${statuses.join(" | ")}`);

  expect(before, "labels flowed before the stop").toBeGreaterThan(5);
  expect(during.filter((s) => s.status === 503).length, "requests while the database was down").toBeGreaterThan(0);
  for (const s of seen.filter((x) => x.status === 503)) expect(s.code).toBe("unavailable:database");
  expect(seen.filter((s) => s.status >= 500 && s.status !== 503), "no 500s").toEqual([]);
  expect(seen.filter((s) => s.status === 0), "the app itself stayed up").toEqual([]);
  expect(acknowledged.size, "labels acknowledged after the restart").toBeGreaterThan(ackAtUp);
  expect(recoveredAt - upAt, "recovery time in ms").toBeLessThan(10_000);

  // Every acknowledged label is stored, and every stored label of the burst was acknowledged.
  const stored = await db
    .select({ id: labels.clientSubmissionId })
    .from(labels)
    .where(and(inArray(labels.annotatorId, team.map((m) => m.user.id)), isNull(labels.undoneAt)));
  expect(new Set(stored.map((s) => s.id))).toEqual(acknowledged);
}, 60_000);
