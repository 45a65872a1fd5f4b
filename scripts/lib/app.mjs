import { spawnSync } from "node:child_process";
import path from "node:path";
import { log, needsBuild, root, spawnChild } from "./services.mjs";

export function buildIfNeeded(env, { force = false } = {}) {
  if (!force && !needsBuild()) return;
  log("building the app (next build)…");
  const r = spawnSync(process.execPath, [path.join(root, "node_modules/next/dist/bin/next"), "build"], { cwd: root, env, stdio: ["ignore", 2, 2] });
  if (r.status !== 0) throw new Error("next build failed");
}

export async function waitForHttp(url, ms) {
  const until = Date.now() + ms;
  let last = "";
  while (Date.now() < until) {
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
      last = `status ${res.status}`;
    } catch (error) {
      last = error.message;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer within ${ms} ms (${last})`);
}

export async function startApp(env, port, { logFile } = {}) {
  // VICINAL_APP_NODE_ARGS: extra node flags for the app process (e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof" when profiling a benchmark).
  const nodeArgs = (env.VICINAL_APP_NODE_ARGS ?? "").split(" ").filter(Boolean);
  const child = spawnChild(`app:${port}`, process.execPath, [...nodeArgs, path.join(root, "node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(port)], { env: { ...env, PORT: String(port) }, logFile });
  await waitForHttp(`http://127.0.0.1:${port}/api/health`, 60_000);
  return child;
}

export function startWorker(env, { logFile, name = "worker" } = {}) {
  return spawnChild(name, process.execPath, [path.join(root, "node_modules/tsx/dist/cli.mjs"), "worker/index.ts"], { env, logFile });
}
