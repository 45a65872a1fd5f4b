import type { JobData } from "@/lib/jobs/queues";
import { runReportComputation } from "@/lib/suggest/jobs";

export async function handleDoubts(data: JobData<"doubts">) {
  await runReportComputation(data.reportId, "doubts");
}
