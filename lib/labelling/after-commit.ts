import "server-only";
import type { ProjectSettings } from "@/lib/projects/settings";
import { maybeEnqueuePoolRank } from "@/lib/suggest";
import { maybeEnqueueDigest } from "./digest";

/** Follow-up work once a label (or undo) has committed; failures here never fail the label. */
export async function afterLabelCommitted({ projectId, settings, openedDispute }: { projectId: number; settings: ProjectSettings; openedDispute: boolean }) {
  const tasks: Array<Promise<unknown>> = [maybeEnqueuePoolRank(projectId)];
  if (openedDispute) tasks.push(maybeEnqueueDigest(projectId, settings.disputeDigestThreshold));
  const results = await Promise.allSettled(tasks);
  for (const r of results) if (r.status === "rejected") console.error("[labelling] after-commit task failed:", (r.reason as Error)?.message ?? r.reason);
}
