import "server-only";
import type { ProjectSettings } from "@/lib/projects/settings";
import { maybeEnqueuePoolRank } from "@/lib/suggest";
import { maybeEnqueueDigest } from "./digest";

/**
 * Follow-up work once a label (or undo) has committed; failures here never fail the label. `poolRankDue: false` (the
 * label's own hint) spares the pool-rank claim, a statement on the knn_state row, until the threshold is near.
 */
export async function afterLabelCommitted({ projectId, settings, openedDispute, poolRankDue }: { projectId: number; settings: ProjectSettings; openedDispute: boolean; poolRankDue?: boolean | null }) {
  const tasks: Array<Promise<unknown>> = poolRankDue === false ? [] : [maybeEnqueuePoolRank(projectId)];
  if (openedDispute) tasks.push(maybeEnqueueDigest(projectId, settings.disputeDigestThreshold));
  const results = await Promise.allSettled(tasks);
  for (const r of results) if (r.status === "rejected") console.error("[labelling] after-commit task failed:", (r.reason as Error)?.message ?? r.reason);
}
