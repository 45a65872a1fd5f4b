// `npm run --silent bench:load`: the annotator path (lease → suggestion → label) under autocannon against a production
// build on loopback with the real database. Progress on stderr; one JSON line last on stdout.
import { randomUUID } from "node:crypto";
import type { ChildProcess } from "node:child_process";
import fs from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { inArray, sql } from "drizzle-orm";
import { db, pool } from "@/db";
import { apiTokens, items, knnState, labelClasses, labels, projectMembers, projects, users } from "@/db/schema";
import { apiTokenPrefix, hashSecret, newSecret } from "@/lib/auth/tokens";
import { defaultProjectSettings, type FeatureSchema } from "@/lib/projects/settings";
import { mulberry32, packFloat32 } from "@/lib/random";

const ITEMS = Number(process.env.BENCH_ITEMS ?? 20_000);
const LABELLED = Number(process.env.BENCH_LABELLED ?? 2_000);
const ANNOTATORS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const DIM = 16;
const CLASSES = ["alpha", "beta", "gamma", "delta"];
const PORT = Number(process.env.BENCH_APP_PORT ?? 3200);
const FLOOR_SECONDS = Number(process.env.BENCH_FLOOR_SECONDS ?? 10);
const root = path.resolve(__dirname, "../..");

// autocannon 9 ships no type declarations: the part of its API used here.
type AcRequest = { method?: string; path?: string; headers?: Record<string, string>; body?: string; setupRequest?: (req: AcRequest, context: any) => AcRequest | null; onResponse?: (status: number, body: string, context: any) => void };
type AcInstance = { stop(): void; on(event: "response", fn: (client: unknown, status: number, bytes: number, ms: number) => void): void; on(event: "reqError" | "done", fn: (arg: unknown) => void): void };
const autocannon = createRequire(__filename)("autocannon") as (opts: { url: string; connections: number; duration: number; timeout: number; requests?: AcRequest[] }) => AcInstance;

const log = (m: string) => process.stderr.write(`[bench:load] ${m}\n`);

type AppModule = {
  buildIfNeeded: (env: NodeJS.ProcessEnv, opts?: { force?: boolean }) => void;
  startApp: (env: NodeJS.ProcessEnv, port: number, opts?: { logFile?: string }) => Promise<ChildProcess>;
};

async function seed() {
  const rand = mulberry32(4242);
  // The seeded labels were given an hour ago, as in a project already under way (not inside the engine's re-read window).
  const earlier = new Date(Date.now() - 3_600_000);
  const schema: FeatureSchema = { source: "table", dimension: DIM, columns: Array.from({ length: DIM }, (_, j) => ({ name: `f${j}`, kind: "numeric" as const, width: 1 })) };
  const [project] = await db
    .insert(projects)
    .values({ name: "Load benchmark", settings: { ...defaultProjectSettings, controlRate: 0, blindShare: 0 }, featureSchema: schema })
    .returning();
  const classes = await db
    .insert(labelClasses)
    .values(CLASSES.map((name, i) => ({ projectId: project.id, name, colour: "#2f7f86", keyHint: i + 1, position: i })))
    .returning();
  const seeders = await db.insert(users).values([0, 1].map((i) => ({ email: `seeder-${i}-${randomUUID().slice(0, 6)}@bench.test`, name: `seeder ${i}` }))).returning();
  const annotators = await db
    .insert(users)
    .values(Array.from({ length: ANNOTATORS }, (_, i) => ({ email: `annotator-${i}-${randomUUID().slice(0, 6)}@bench.test`, name: `annotator ${i}` })))
    .returning();
  await db.insert(projectMembers).values([...seeders, ...annotators].map((u) => ({ projectId: project.id, userId: u.id, role: "annotator" as const })));
  const tokens: string[] = [];
  for (const u of annotators) {
    const secret = newSecret(apiTokenPrefix);
    tokens.push(secret);
    await db.insert(apiTokens).values({ userId: u.id, name: "bench", tokenHash: hashSecret(secret), prefix: secret.slice(0, 10) });
  }
  // Four loose clusters in 16 dimensions (invented data); the first LABELLED items carry their cluster as an agreed label.
  for (let start = 0; start < ITEMS; start += 2_000) {
    const rows = [];
    for (let i = start; i < Math.min(ITEMS, start + 2_000); i += 1) {
      const g = i % CLASSES.length;
      const v = Array.from({ length: DIM }, (_, j) => (j % CLASSES.length === g ? 3 : 0) + rand() * 2);
      const labelled = i < LABELLED;
      rows.push({
        projectId: project.id,
        externalId: `L-${String(i).padStart(6, "0")}`,
        fields: Object.fromEntries(v.map((x, j) => [`f${j}`, Number(x.toFixed(4))])),
        vector: packFloat32(v),
        status: labelled ? ("agreed" as const) : ("unlabelled" as const),
        labelCount: labelled ? 2 : 0,
        finalClassId: labelled ? classes[g].id : null,
        finalSource: labelled ? ("agreed" as const) : null,
        decidedAt: labelled ? earlier : null,
      });
    }
    const inserted = await db.insert(items).values(rows).returning({ id: items.id, externalId: items.externalId, finalClassId: items.finalClassId });
    const seeded = inserted.filter((r) => r.finalClassId != null).flatMap((r) => seeders.map((s) => ({ projectId: project.id, itemId: r.id, annotatorId: s.id, classId: r.finalClassId!, clientSubmissionId: randomUUID(), createdAt: earlier })));
    if (seeded.length) await db.insert(labels).values(seeded);
  }
  await db.insert(knnState).values({ projectId: project.id }).onConflictDoNothing();
  if (process.env.BENCH_TRY_INDEXES === "1") {
    // Experiment only (not in the schema): the indexes docs/load-and-faults.md proposes, to measure what they change.
    log("creating the proposed indexes (BENCH_TRY_INDEXES=1)");
    await pool.query(`create index if not exists bench_lease_lc_idx on items (project_id, score_least_confident desc nulls last, seq)
      where status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null`);
    await pool.query("create index if not exists bench_items_decided_idx on items (project_id, decided_at) where decided_at is not null");
    await pool.query("create index if not exists bench_labels_created_idx on labels (project_id, created_at)");
    await pool.query("create index if not exists bench_labels_undone_idx on labels (project_id, undone_at) where undone_at is not null");
  }
  await pool.query("analyze items; analyze labels; analyze assignments");
  return { project, classes, annotators, tokens };
}

type Step = "lease" | "suggestion" | "label";
const stepLatency: Record<Step, number[]> = { lease: [], suggestion: [], label: [] };
const statusCounts: Record<string, number> = {};
const acknowledgedIds: string[] = [];
let lastStep: Step = "lease";
const instances: AcInstance[] = [];
let labelsSent = 0;
let errors = 0;

function percentile(sorted: number[], p: number) {
  if (!sorted.length) return 0;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

/** One annotator on one connection: lease → suggestion → label, in a loop, with its own token. */
function annotator(base: string, projectId: number, token: string, stopAt: number) {
  const headers = { authorization: `Bearer ${token}`, "content-type": "application/json" };
  type Ctx = { itemId?: number; topClassId?: number | null; suggestionToken?: string | null; classIds?: number[]; submission?: string };
  let instance: AcInstance;
  const count = (step: Step, status: number) => {
    lastStep = step;
    statusCounts[`${step} ${status}`] = (statusCounts[`${step} ${status}`] ?? 0) + 1;
  };
  const parse = (body: string) => {
    try {
      return JSON.parse(body);
    } catch {
      return null;
    }
  };
  instance = autocannon({
    url: base,
    connections: 1,
    duration: SECONDS + 20,
    timeout: 10,
    requests: [
      {
        method: "POST",
        path: `/api/v1/projects/${projectId}/desk/next`,
        headers,
        body: "{}",
        onResponse: (status, body, context: Ctx) => {
          count("lease", status);
          const data = status === 200 ? parse(body)?.data : null;
          context.itemId = data?.itemId;
          context.suggestionToken = data?.suggestionToken ?? null;
        },
      },
      {
        method: "GET",
        headers,
        setupRequest: (req, context: Ctx) => (context.itemId ? { ...req, path: `/api/v1/projects/${projectId}/items/${context.itemId}/suggestion` } : null),
        onResponse: (status, body, context: Ctx) => {
          count("suggestion", status);
          const data = status === 200 ? parse(body)?.data : null;
          context.topClassId = data?.topClassId ?? null;
          context.classIds = data ? Object.keys(data.shares ?? {}).map(Number) : [];
        },
      },
      {
        method: "POST",
        headers,
        setupRequest: (req, context: Ctx) => {
          // autocannon's stop() takes effect at its next one-second tick: past the window no label starts, so none is cut in flight.
          if (Date.now() >= stopAt) {
            setImmediate(() => instance.stop());
            return null;
          }
          if (!context.itemId || !context.classIds?.length) return null;
          context.submission = randomUUID();
          labelsSent += 1;
          const take = context.topClassId != null && context.suggestionToken != null;
          const classId = take ? context.topClassId! : context.classIds[0];
          const body = { clientSubmissionId: context.submission, classId, via: take ? "take" : "choose", suggestionToken: context.suggestionToken };
          return { ...req, path: `/api/v1/projects/${projectId}/items/${context.itemId}/labels`, body: JSON.stringify(body) };
        },
        onResponse: (status, _body, context: Ctx) => {
          count("label", status);
          if (status >= 200 && status < 300 && context.submission) acknowledgedIds.push(context.submission);
          // Stop between loops, never with a label in flight, so every label sent has an answer.
          if (Date.now() >= stopAt) setImmediate(() => instance.stop());
        },
      },
    ],
  });
  instances.push(instance);
  instance.on("response", (_client, status: number, _bytes: number, ms: number) => {
    stepLatency[lastStep].push(ms);
    if (status < 200 || status >= 300) errors += 1;
  });
  instance.on("reqError", () => (errors += 1));
  return new Promise<unknown>((resolve) => instance.on("done", resolve));
}

/** CPU seconds used so far by each process tree (utime + stime from /proc, Linux) and by the whole machine. */
function cpuSnapshot(appPid: number, postmasterPid: number) {
  const tick = 100; // USER_HZ: 100 on Linux (getconf CLK_TCK)
  const stats = new Map<number, { ppid: number; cpu: number }>();
  for (const name of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const text = fs.readFileSync(`/proc/${name}/stat`, "utf8");
      const f = text.slice(text.lastIndexOf(")") + 2).split(" ");
      stats.set(Number(name), { ppid: Number(f[1]), cpu: (Number(f[11]) + Number(f[12])) / tick });
    } catch {
      // the process ended meanwhile
    }
  }
  const tree = (root: number) => {
    let sum = 0;
    const todo = [root];
    while (todo.length) {
      const pid = todo.pop()!;
      sum += stats.get(pid)?.cpu ?? 0;
      for (const [child, s] of stats) if (s.ppid === pid) todo.push(child);
    }
    return sum;
  };
  const [, user, nice, system, idle, iowait, irq, softirq, steal] = fs.readFileSync("/proc/stat", "utf8").split("\n")[0].trim().split(/\s+/).map(Number);
  return { app: tree(appPid), database: tree(postmasterPid), machineBusy: (user + nice + system + irq + softirq + steal) / tick, machineAll: (user + nice + system + idle + iowait + irq + softirq + steal) / tick };
}

/**
 * The same-run floor: as many connections on GET /api/health/live, a route that does no work of Vicinal's (no database,
 * no authentication). Its latency is what `next start` on this machine costs per request under this concurrency.
 */
async function measureFloor(base: string) {
  const ms: number[] = [];
  let failed = 0;
  const instance = autocannon({ url: `${base}/api/health/live`, connections: ANNOTATORS, duration: FLOOR_SECONDS, timeout: 10 });
  instance.on("response", (_client, status: number, _bytes: number, t: number) => {
    ms.push(t);
    if (status !== 200) failed += 1;
  });
  instance.on("reqError", () => (failed += 1));
  await new Promise((resolve) => instance.on("done", resolve));
  ms.sort((a, b) => a - b);
  return { route: "/api/health/live", seconds: FLOOR_SECONDS, requests: ms.length, p50Ms: percentile(ms, 50), p95Ms: percentile(ms, 95), errors: failed };
}

async function main() {
  process.env.VICINAL_DIST_DIR ??= ".next-bench";
  const app = (await import(pathToFileURL(path.join(root, "scripts/lib/app.mjs")).href)) as AppModule;
  const env = { ...process.env, VICINAL_SKIP_BUILD_TYPECHECK: "1" };
  for (let attempt = 1; ; attempt += 1) {
    try {
      app.buildIfNeeded(env);
      break;
    } catch (error) {
      if (attempt >= 3) throw error;
      log(`build failed (attempt ${attempt}); retrying in 10 s`);
      await new Promise((r) => setTimeout(r, 10_000));
    }
  }
  log(`seeding ${ITEMS} items (${LABELLED} labelled) and ${ANNOTATORS} annotators…`);
  const t0 = Date.now();
  const world = await seed();
  log(`seeded in ${((Date.now() - t0) / 1000).toFixed(1)} s; starting the app on 127.0.0.1:${PORT}`);
  const dataDir = process.env.VICINAL_BENCH_DATA ?? path.join(root, ".data/bench");
  const child = await app.startApp(env, PORT, { logFile: path.join(dataDir, "app-load.log") });
  const base = `http://127.0.0.1:${PORT}`;
  let floor: Awaited<ReturnType<typeof measureFloor>> | null = null;
  let cpuBefore: ReturnType<typeof cpuSnapshot>;
  let cpu: { appMsPerLabel: number; databaseMsPerLabel: number; machineBusyShare: number } | null = null;
  try {
    // One warm-up loop per annotator builds the project's index and compiles the routes before the clock starts.
    const warm = await fetch(`${base}/api/v1/projects/${world.project.id}/desk/next`, { method: "POST", headers: { authorization: `Bearer ${world.tokens[0]}`, "content-type": "application/json" }, body: "{}" });
    log(`warm-up lease: ${warm.status}`);
    if (process.env.BENCH_HOLD) {
      // Manual probing: leave the seeded app up and write what a probe needs; stops when BENCH_HOLD's file is removed.
      const fs = await import("node:fs");
      fs.writeFileSync(process.env.BENCH_HOLD, JSON.stringify({ base, projectId: world.project.id, tokens: world.tokens }));
      log(`holding: ${process.env.BENCH_HOLD}`);
      while (fs.existsSync(process.env.BENCH_HOLD)) await new Promise((r) => setTimeout(r, 1000));
      child.kill("SIGTERM");
      process.exit(0);
    }
    log(`floor: ${ANNOTATORS} connections on /api/health/live for ${FLOOR_SECONDS} s…`);
    floor = await measureFloor(base);
    log(`floor: ${JSON.stringify(floor)}`);
    const postmasterPid = Number(fs.readFileSync(path.join(dataDir, "pg/postmaster.pid"), "utf8").split("\n")[0]);
    cpuBefore = cpuSnapshot(child.pid!, postmasterPid);
    const stopAt = Date.now() + SECONDS * 1000;
    const progress = setInterval(() => {
      const done = stepLatency.lease.length + stepLatency.suggestion.length + stepLatency.label.length;
      log(`${Math.round((Date.now() - (stopAt - SECONDS * 1000)) / 1000)} s: ${done} requests, ${acknowledgedIds.length} labels acknowledged, ${errors} errors`);
    }, 5_000);
    const runs = world.tokens.map((t) => annotator(base, world.project.id, t, stopAt));
    // A connection stuck past the window (no label answer within 15 s more) is stopped as it is.
    const hardStop = setTimeout(() => instances.forEach((i) => i.stop()), SECONDS * 1000 + 15_000);
    await Promise.all(runs);
    clearTimeout(hardStop);
    clearInterval(progress);
    const after = cpuSnapshot(child.pid!, postmasterPid);
    const loops = acknowledgedIds.length || 1;
    cpu = {
      appMsPerLabel: Number((((after.app - cpuBefore.app) * 1000) / loops).toFixed(2)),
      databaseMsPerLabel: Number((((after.database - cpuBefore.database) * 1000) / loops).toFixed(2)),
      machineBusyShare: Number(((after.machineBusy - cpuBefore.machineBusy) / (after.machineAll - cpuBefore.machineAll)).toFixed(3)),
    };
    log(`cpu: ${JSON.stringify(cpu)}`);
  } finally {
    child.kill("SIGTERM");
  }
  const annotatorIds = world.annotators.map((a) => a.id);
  const [{ n: stored }] = await db.select({ n: sql<number>`count(*)::int` }).from(labels).where(sql`${inArray(labels.annotatorId, annotatorIds)} and ${labels.undoneAt} is null`);
  const found = acknowledgedIds.length ? (await pool.query("select count(*)::int as n from labels where client_submission_id = any($1::uuid[]) and undone_at is null", [acknowledgedIds])).rows[0].n : 0;
  const all = [...stepLatency.lease, ...stepLatency.suggestion, ...stepLatency.label].sort((a, b) => a - b);
  const p95 = percentile(all, 95);
  const perStep = Object.fromEntries(
    (Object.keys(stepLatency) as Step[]).map((s) => {
      const v = [...stepLatency[s]].sort((a, b) => a - b);
      return [s, { n: v.length, p50Ms: percentile(v, 50), p95Ms: percentile(v, 95) }];
    }),
  );
  log(`per step: ${JSON.stringify(perStep)}`);
  log(`statuses: ${JSON.stringify(statusCounts)}`);
  log(`acknowledged labels found in the database: ${found} of ${acknowledgedIds.length}`);
  await pool.end();
  process.stdout.write(
    `${JSON.stringify({
      connections: ANNOTATORS,
      seconds: SECONDS,
      requests: all.length,
      p50Ms: percentile(all, 50),
      p95Ms: p95,
      errors,
      acknowledged: acknowledgedIds.length,
      stored,
      unanswered: labelsSent - stepLatency.label.length,
      steps: perStep,
      floor,
      p95OverFloor: floor?.p95Ms ? Number((p95 / floor.p95Ms).toFixed(2)) : null,
      throughputOverFloor: floor?.requests ? Number((all.length / SECONDS / (floor.requests / floor.seconds)).toFixed(3)) : null,
      cpu,
    })}\n`,
  );
  process.exit(0);
}

main().catch((error) => {
  log(`failed: ${(error as Error).stack ?? error}`);
  process.exit(1);
});
