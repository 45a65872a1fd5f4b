// Stops, starts and restarts the test cluster's own services (PostgreSQL, s3rver, app, worker) for fault tests.
// Everything is found from the harness's environment: VICINAL_TEST_DATA (the profile's data folder), DATABASE_URL,
// S3_ENDPOINT, VICINAL_WORKER_PID and VICINAL_HARNESS_PID (scripts/test.mjs). Processes started here are watched by a
// small guard process that ends them when the harness exits, so a replacement worker or s3rver outlives one test file
// (later suites need them) but never the run.
import { execFile, spawn } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import path from "node:path";
import { promisify } from "node:util";

const exec = promisify(execFile);
const root = path.resolve(__dirname, "../..");

export const dataDir = path.resolve(process.env.VICINAL_TEST_DATA ?? path.join(root, ".data/test"));
export const pgPort = Number(new URL(process.env.DATABASE_URL ?? "postgres://x@127.0.0.1:55433/vicinal").port);
export const s3Port = Number(new URL(process.env.S3_ENDPOINT ?? "http://127.0.0.1:4579").port);
const harnessPid = Number(process.env.VICINAL_HARNESS_PID ?? process.ppid);
const workerPidFile = path.join(dataDir, "worker.pid");

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function pgBinDir(): string {
  const base = "/usr/lib/postgresql";
  const versions = fs.readdirSync(base).filter((v) => fs.existsSync(path.join(base, v, "bin", "pg_ctl"))).sort((a, b) => Number(b) - Number(a));
  if (!versions.length) throw new Error("PostgreSQL binaries not found under /usr/lib/postgresql");
  return path.join(base, versions[0], "bin");
}

/** pg_ctl as the harness runs it (as `postgres` when we are root), asynchronously so the test's requests keep flowing. */
async function pgCtl(args: string[]) {
  const cmd = path.join(pgBinDir(), "pg_ctl");
  const asRoot = process.getuid?.() === 0;
  const [bin, argv] = asRoot ? ["runuser", ["-u", "postgres", "--", cmd, ...args]] : [cmd, args];
  await exec(bin, argv, { timeout: 90_000 });
}

export async function stopPostgres() {
  await pgCtl(["-D", path.join(dataDir, "pg"), "-m", "fast", "-w", "stop"]);
}

/** Same server options as scripts/lib/services.mjs startPostgres. */
export async function startPostgres() {
  const opts = `-k ${path.join(dataDir, "pg-sock")} -p ${pgPort} -c listen_addresses=127.0.0.1 -c max_connections=200 -c shared_buffers=256MB -c max_wal_size=4GB`;
  await pgCtl(["-D", path.join(dataDir, "pg"), "-l", path.join(dataDir, "postgres.log"), "-o", opts, "-w", "-t", "60", "start"]);
}

export async function portOpen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.connect(port, "127.0.0.1");
    s.once("connect", () => {
      s.destroy();
      resolve(true);
    });
    s.once("error", () => resolve(false));
  });
}

export async function waitForPort(port: number, open: boolean, ms = 30_000) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if ((await portOpen(port)) === open) return;
    await sleep(100);
  }
  throw new Error(`port ${port} did not ${open ? "open" : "close"} within ${ms} ms`);
}

/** Running (not gone, not a zombie: the harness cannot reap its killed children while it waits for vitest). */
export function alive(pid: number): boolean {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, "utf8");
    return stat.slice(stat.lastIndexOf(")") + 2, stat.lastIndexOf(")") + 3) !== "Z";
  } catch {
    return false;
  }
}

async function waitForExit(pid: number, ms = 15_000) {
  const until = Date.now() + ms;
  while (alive(pid) && Date.now() < until) await sleep(50);
  if (alive(pid)) throw new Error(`process ${pid} did not exit within ${ms} ms`);
}

/** The pid and every descendant (tsx runs the script in a child process; killing only the parent would orphan it). */
export function processTree(pid: number): number[] {
  const parents = new Map<number, number[]>();
  for (const name of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${name}/stat`, "utf8");
      const ppid = Number(stat.slice(stat.lastIndexOf(")") + 2).split(" ")[1]);
      parents.set(ppid, [...(parents.get(ppid) ?? []), Number(name)]);
    } catch {
      /* gone */
    }
  }
  const out = [pid];
  for (let i = 0; i < out.length; i += 1) out.push(...(parents.get(out[i]) ?? []));
  return out;
}

/** Signals a process and its descendants, deepest first, and waits until all are gone. */
export async function killTree(pid: number, signal: NodeJS.Signals) {
  const tree = processTree(pid).reverse();
  for (const p of tree) {
    try {
      process.kill(p, signal);
    } catch {
      /* already gone */
    }
  }
  for (const p of tree) await waitForExit(p);
}

/** Pids whose command line has every one of `parts` (exact arguments), from /proc. */
function pidsWithArgs(parts: string[]): number[] {
  const out: number[] = [];
  for (const name of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    let args: string[];
    try {
      args = fs.readFileSync(`/proc/${name}/cmdline`, "utf8").split("\0");
    } catch {
      continue;
    }
    if (parts.every((p) => args.includes(p))) out.push(Number(name));
  }
  return out;
}

/** Starts a process detached, with a guard that ends it once `guardPid` (the harness by default) is gone. */
export function spawnGuarded(name: string, args: string[], opts: { env?: NodeJS.ProcessEnv; guardPid?: number } = {}): number {
  const log = fs.openSync(path.join(dataDir, `${name}.log`), "a");
  const child = spawn(process.execPath, args, { cwd: root, env: opts.env ?? process.env, detached: true, stdio: ["ignore", log, log] });
  child.unref();
  fs.closeSync(log);
  const guard = `const [g, c] = [${opts.guardPid ?? harnessPid}, ${child.pid}];
const alive = (p) => { try { const s = require("fs").readFileSync("/proc/" + p + "/stat", "utf8"); return s[s.lastIndexOf(")") + 2] !== "Z"; } catch { return false; } };
setInterval(() => { if (!alive(c)) process.exit(0); if (!alive(g)) { try { process.kill(c, "SIGTERM"); } catch {} process.exit(0); } }, 1000);`;
  spawn(process.execPath, ["-e", guard], { detached: true, stdio: "ignore" }).unref();
  return child.pid!;
}

const s3Args = () => [path.join(root, "node_modules/s3rver/bin/s3rver.js"), "-d", path.join(dataDir, "s3")];

/** Stops this cluster's s3rver (found by its data folder) and waits until its port refuses connections. */
export async function stopS3() {
  const pids = pidsWithArgs(s3Args());
  if (!pids.length) throw new Error(`no s3rver running on ${path.join(dataDir, "s3")}`);
  for (const pid of pids) process.kill(pid, "SIGTERM");
  for (const pid of pids) await waitForExit(pid);
  await waitForPort(s3Port, false);
}

export async function startS3() {
  spawnGuarded("s3rver-restarted", [...s3Args(), "-a", "127.0.0.1", "-p", String(s3Port), "--silent"]);
  await waitForPort(s3Port, true);
}

/** The pid of this cluster's worker: the last one started here, else the harness's. */
export function workerPid(): number | null {
  const fromFile = fs.existsSync(workerPidFile) ? Number(fs.readFileSync(workerPidFile, "utf8")) : NaN;
  if (Number.isFinite(fromFile) && alive(fromFile)) return fromFile;
  const fromEnv = Number(process.env.VICINAL_WORKER_PID);
  return Number.isFinite(fromEnv) && fromEnv > 0 && alive(fromEnv) ? fromEnv : null;
}

export async function killWorker(signal: NodeJS.Signals = "SIGKILL") {
  const pid = workerPid();
  if (pid == null) throw new Error("no worker process found (VICINAL_WORKER_PID is set by scripts/test.mjs)");
  await killTree(pid, signal);
  return pid;
}

/** Starts a new worker (worker/index.ts) and waits for its "ready" line. */
export async function startWorker(ms = 45_000, env: Record<string, string> = {}): Promise<number> {
  const logFile = path.join(dataDir, "worker-restarted.log");
  const before = fs.existsSync(logFile) ? fs.statSync(logFile).size : 0;
  const pid = spawnGuarded("worker-restarted", [path.join(root, "node_modules/tsx/dist/cli.mjs"), "worker/index.ts"], { env: { ...process.env, ...env } });
  fs.writeFileSync(workerPidFile, String(pid));
  const until = Date.now() + ms;
  while (Date.now() < until) {
    const text = fs.readFileSync(logFile, "utf8").slice(before);
    if (text.includes("[worker] ready")) return pid;
    if (!alive(pid)) throw new Error(`the new worker exited:\n${text}`);
    await sleep(200);
  }
  throw new Error(`the new worker was not ready within ${ms} ms`);
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const port = (srv.address() as net.AddressInfo).port;
      srv.close(() => resolve(port));
    });
  });
}

/** A second app server (`next start`, same build and database) on another port; stop() ends it. */
export async function startSecondApp(port: number, ms = 60_000) {
  const pid = spawnGuarded(`app-${port}`, [path.join(root, "node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...process.env, PORT: String(port) },
    guardPid: process.pid,
  });
  const until = Date.now() + ms;
  let ready = false;
  while (!ready && Date.now() < until) {
    ready = await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.status < 500, () => false);
    if (!ready) await sleep(250);
  }
  if (!ready) throw new Error(`the second app on port ${port} did not answer within ${ms} ms`);
  return {
    url: `http://localhost:${port}`,
    stop: async () => {
      if (alive(pid)) await killTree(pid, "SIGTERM");
    },
  };
}
