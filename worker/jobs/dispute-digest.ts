import type { JobData } from "@/lib/jobs/queues";
import { runDisputeDigest } from "@/lib/labelling/digest";

/** Queue "dispute-digest": e-mails the project's reviewers when open disputes pass the project's threshold. */
export async function handleDisputeDigest(data: JobData<"dispute-digest">) {
  const result = await runDisputeDigest(data.projectId);
  console.log(`[dispute-digest] project ${data.projectId}: ${result.skipped ?? `sent to ${result.sent.length}`} (${result.open} open)`);
}
