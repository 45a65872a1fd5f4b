import { pool } from "@/db";
import { enqueue } from "@/lib/jobs/boss";

/** Queues a re-ranking of the project's unlabelled pool (e.g. once after the seed or an import). */
export async function enqueuePoolRank(projectId: number): Promise<string | null> {
  return enqueue("pool-rank", { projectId }, { singletonKey: `pool-rank:${projectId}` });
}

/**
 * Queues a pool re-ranking when knn_state.labels_since_pool_rank has reached the project's
 * settings.poolRerankEvery. The counter is claimed (reset to 0) in the same statement, so of
 * several processes calling this at once exactly one enqueues. Call after the label's commit.
 */
export async function maybeEnqueuePoolRank(projectId: number): Promise<boolean> {
  const res = await pool.query({
    name: "vicinal_pool_rank_claim",
    text: `update knn_state ks set labels_since_pool_rank = 0, updated_at = now()
     from projects p
     where p.id = ks.project_id and ks.project_id = $1
       and ks.labels_since_pool_rank >= coalesce((p.settings->>'poolRerankEvery')::int, 25)
     returning ks.project_id`,
    values: [projectId],
  });
  if (!res.rowCount) return false;
  await enqueuePoolRank(projectId);
  return true;
}
