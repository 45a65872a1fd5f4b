import type { JobData } from "@/lib/jobs/queues";
import { runReportComputation } from "@/lib/suggest/jobs";

export async function handleMap(data: JobData<"map">) {
  await runReportComputation(data.reportId, "map");
}
