import type { JobData } from "@/lib/jobs/queues";
import { runPoolRank } from "@/lib/suggest/pool-rank";

export async function handlePoolRank(data: JobData<"pool-rank">) {
  const summary = await runPoolRank(data.projectId);
  console.log(`[pool-rank] ${JSON.stringify(summary)}`);
}
