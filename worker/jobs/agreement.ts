import type { JobData } from "@/lib/jobs/queues";
import { runQueuedAgreement } from "@/lib/agreement-server/cache";

/** Queue "agreement": computes and caches a large project's agreement report (projects past the inline limit). */
export async function handleAgreement(data: JobData<"agreement">) {
  const stored = await runQueuedAgreement({ projectId: data.projectId });
  console.log(`[agreement] project ${data.projectId}: ${stored.labels} labels, version ${stored.knnVersion}, ${stored.seconds} s`);
}
