// `npm test`: a fresh, isolated test cluster; unit, integration (real PostgreSQL, real server) and e2e (Chromium) tests.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { buildIfNeeded, startApp, startWorker } from "./lib/app.mjs";
import { ensureChromium, ensureNodeModules, installSignalHandlers, log, profiles, root, startServices, stopAll } from "./lib/services.mjs";

const args = process.argv.slice(2);
const only = args.filter((a) => !a.startsWith("--"));
const t0 = Date.now();
installSignalHandlers();

function vitest(env, paths, reportFile) {
  const r = spawnSync(process.execPath, [path.join(root, "node_modules/vitest/vitest.mjs"), "run", ...paths, "--reporter=default", "--reporter=json", `--outputFile.json=${reportFile}`], { cwd: root, env, stdio: ["ignore", "inherit", "inherit"] });
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  try {
    const report = JSON.parse(fs.readFileSync(reportFile, "utf8"));
    passed = report.numPassedTests;
    failed = report.numFailedTests;
    skipped = report.numPendingTests + report.numTodoTests;
    if (r.status !== 0 && failed === 0) failed = 1;
  } catch {
    if (r.status !== 0) failed = 1;
  }
  return { passed, failed, skipped, ok: r.status === 0 };
}

let totals = { passed: 0, failed: 0, skipped: 0 };
let ok = true;
try {
  ensureNodeModules();
  const chromium = ensureChromium();
  const profile = profiles.test;
  const { env: base } = await startServices(profile, { fresh: true });
  const reports = path.join(profile.dataDir, "reports");
  fs.mkdirSync(reports, { recursive: true });
  fs.mkdirSync(path.join(profile.dataDir, "screenshots"), { recursive: true });
  if (!only.length || args.includes("--typecheck")) {
    log("type-checking (tsc --noEmit)…");
    const tc = spawnSync(process.execPath, [path.join(root, "node_modules/typescript/bin/tsc"), "--noEmit", "-p", "."], { cwd: root, stdio: ["ignore", "inherit", "inherit"] });
    if (tc.status === 0) totals.passed += 1;
    else { totals.failed += 1; ok = false; }
  }
  const env = { ...base, VICINAL_SKIP_BUILD_TYPECHECK: "1", VICINAL_TEST_APP_URL: `http://localhost:${profile.appPort}`, VICINAL_CHROMIUM: chromium, VICINAL_TEST_DATA: profile.dataDir, VICINAL_HARNESS_PID: String(process.pid) };
  // Fault tests stop and restart the cluster's services, so they run alone, after the other integration tests.
  const faults = "tests/integration/faults";
  const suites = [["unit", ["tests/unit"]], ["integration", ["tests/integration"]], ["faults", [faults]], ["e2e", ["tests/e2e"]]]
    .map(([name, paths]) => [name, only.length ? only.filter((o) => o.startsWith(paths[0]) && (name !== "integration" || !o.startsWith(faults))) : paths])
    .filter(([, paths]) => paths.length);
  const needsApp = suites.some(([name]) => name !== "unit");
  for (const [name, paths] of suites) {
    if (name !== "unit" && needsApp && !env.__appStarted) {
      buildIfNeeded(env);
      env.VICINAL_WORKER_PID = String(startWorker(env, { logFile: path.join(profile.dataDir, "worker.log") }).pid);
      await startApp(env, profile.appPort, { logFile: path.join(profile.dataDir, "app.log") });
      env.__appStarted = "1";
    }
    log(`running ${name} tests…`);
    const extra = { integration: ["--exclude", `${faults}/**`], faults: ["--no-file-parallelism"] }[name] ?? [];
    const r = vitest(env, [...paths, ...extra], path.join(reports, `${name}.json`));
    totals = { passed: totals.passed + r.passed, failed: totals.failed + r.failed, skipped: totals.skipped + r.skipped };
    ok &&= r.ok;
  }
} catch (error) {
  log(`test setup failed: ${error.stack ?? error.message}`);
  ok = false;
  totals.failed += 1;
}
stopAll();
log(`finished in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
process.stdout.write(`${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped\n`);
process.exit(ok && totals.failed === 0 ? 0 : 1);
