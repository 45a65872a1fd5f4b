import { parentPort, workerData } from "node:worker_threads";
import { rankSlice, type PoolTask } from "./pool-shared";

try {
  rankSlice(workerData as PoolTask);
  parentPort?.postMessage({ ok: true });
} catch (error) {
  parentPort?.postMessage({ ok: false, message: error instanceof Error ? error.stack ?? error.message : String(error) });
}
