import type { JobData } from "@/lib/jobs/queues";
import { runReportComputation } from "@/lib/suggest/jobs";

export async function handleTuning(data: JobData<"tuning">) {
  await runReportComputation(data.reportId, "tuning");
}
