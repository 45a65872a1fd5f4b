// `npm start`: everything on loopback, demo data, the production app at http://localhost:3000 and the worker.
import { buildIfNeeded, startApp, startWorker } from "./lib/app.mjs";
import { ensureNodeModules, installSignalHandlers, log, profiles, runNode, startServices, stopAll } from "./lib/services.mjs";

const t0 = Date.now();
installSignalHandlers();
try {
  ensureNodeModules();
  const profile = profiles.dev;
  const { env } = await startServices(profile);
  log("seeding the demo (once)…");
  runNode(["node_modules/tsx/dist/cli.mjs", "db/seed.ts"], env);
  buildIfNeeded(env);
  startWorker(env);
  await startApp(env, profile.appPort);
  const seconds = ((Date.now() - t0) / 1000).toFixed(1);
  process.stderr.write(`
  Vicinal is running (ready in ${seconds} s)

    App            http://localhost:${profile.appPort}
    Mail catcher   http://localhost:${profile.mailWebPort}   (every e-mail Vicinal sends)
    Object store   http://localhost:${profile.s3Port}        (fake S3, bucket "vicinal")
    PostgreSQL     127.0.0.1:${profile.pgPort}, data in .data/dev

  Demo sign-ins (password for all: vicinal-demo-2026)
    admin@vicinal.test      site admin
    owner@vicinal.test      owner of "Pipe inspection grades"
    reviewer@vicinal.test   reviewer
    ana@vicinal.test        annotator
    ben@vicinal.test        annotator

  Ctrl-C stops everything.
`);
} catch (error) {
  log(`start failed: ${error.message}`);
  stopAll();
  process.exit(1);
}
