// The background worker: a pg-boss consumer. Start more of these processes to scale out.
import { createWorkerBoss } from "@/lib/jobs/boss";
import { type JobName, jobSchemas } from "@/lib/jobs/queues";
import { handlers } from "./registry";
import { failStalledImports, watchMs } from "./watch/stalled-imports";

const concurrency: Partial<Record<JobName, number>> = { mail: 4, import: 1, edition: 1, "pool-rank": 1, tuning: 1 };

async function main() {
  const boss = await createWorkerBoss();
  for (const [name, handler] of Object.entries(handlers) as Array<[JobName, (data: unknown) => Promise<void>]>) {
    // pg-boss 10 runs one fetch loop per work() call: call it n times for n jobs at once.
    for (let i = 0; i < (concurrency[name] ?? 1); i += 1) {
      await boss.work(name, { batchSize: 1, pollingIntervalSeconds: 0.5 }, async (jobs) => {
        for (const job of jobs) {
          const data = jobSchemas[name].parse(job.data);
          await handler(data);
        }
      });
    }
  }
  // Every worker watches for imports whose worker died (see watch/stalled-imports.ts), at start and then regularly.
  const watch = () => failStalledImports(boss).catch((error: Error) => console.error("[worker] stalled-import watch:", error.message));
  await watch();
  const watchTimer = setInterval(watch, watchMs());
  console.log(`[worker] ready: ${Object.keys(handlers).join(", ")}`);
  const stop = async () => {
    clearInterval(watchTimer);
    await boss.stop({ graceful: true, timeout: 10_000 }).catch(() => undefined);
    process.exit(0);
  };
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}

// A dropped database connection (e.g. PostgreSQL restarting) can reject inside pg-boss's own loops;
// log it and keep working — pg-boss reconnects, and the job it was handling is retried by its policy.
process.on("unhandledRejection", (reason) => {
  console.error("[worker] unhandled rejection:", reason instanceof Error ? reason.message : reason);
});

main().catch((error) => {
  console.error("[worker] failed to start", error);
  process.exit(1);
});
