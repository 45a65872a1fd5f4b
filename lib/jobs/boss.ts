import PgBoss from "pg-boss";
import { env } from "@/lib/env";
import { type JobData, type JobName, jobNames, jobSchemas, queuePolicies } from "./queues";

const globalForBoss = globalThis as unknown as { vicinalBoss?: Promise<PgBoss> };

async function createBoss(role: "sender" | "worker"): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: env.DATABASE_URL,
    schema: "pgboss",
    max: role === "sender" ? 3 : 6,
    supervise: role === "worker",
    schedule: role === "worker",
    migrate: true,
  });
  boss.on("error", (error) => console.error("[jobs]", error.message));
  await boss.start();
  for (const name of jobNames) {
    await boss.createQueue(name, { name, ...queuePolicies[name] }).catch(() => undefined);
  }
  return boss;
}

/** The app's handle on the queue (sends only). */
export function getBoss(): Promise<PgBoss> {
  if (!globalForBoss.vicinalBoss) {
    globalForBoss.vicinalBoss = createBoss("sender").catch((error) => {
      globalForBoss.vicinalBoss = undefined;
      throw error;
    });
  }
  return globalForBoss.vicinalBoss;
}

export function createWorkerBoss() {
  return createBoss("worker");
}

export async function enqueue<N extends JobName>(name: N, data: JobData<N>, options: { singletonKey?: string; startAfter?: number } = {}) {
  const payload = jobSchemas[name].parse(data);
  const boss = await getBoss();
  return boss.send(name, payload as object, { ...queuePolicies[name], ...options });
}

export async function queueHealthy(): Promise<boolean> {
  try {
    const boss = await getBoss();
    await boss.getQueueSize("mail");
    return true;
  } catch {
    return false;
  }
}
