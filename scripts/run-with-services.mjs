// Runs a command with what it needs: npm packages, and (unless --no-services) the bench profile's PostgreSQL, object storage and mail.
import { spawnSync } from "node:child_process";
import { ensureNodeModules, installSignalHandlers, profiles, root, startServices, stopAll } from "./lib/services.mjs";

const argv = process.argv.slice(2);
const sep = argv.indexOf("--");
const flags = argv.slice(0, sep);
const [cmd, ...args] = argv.slice(sep + 1);
installSignalHandlers();
ensureNodeModules();
let env = { ...process.env };
if (flags.includes("--services")) {
  ({ env } = await startServices(profiles.bench, { fresh: flags.includes("--fresh") }));
  env = { ...env, VICINAL_BENCH_DATA: profiles.bench.dataDir };
}
const bin = cmd === "tsx" ? [process.execPath, ["node_modules/tsx/dist/cli.mjs", ...args]] : [cmd, args];
const r = spawnSync(bin[0], bin[1], { cwd: root, env, stdio: "inherit" });
stopAll();
process.exit(r.status ?? 1);
