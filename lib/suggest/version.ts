import { sql } from "drizzle-orm";
import type { DbOrTx } from "@/db";

/**
 * Marks the project's votes as changed: every app process compares its cached version with this
 * one before answering. Also counts label events towards the next pool re-ranking. Call inside the
 * transaction that adds/undoes a label, sets a final label or issues a ruling: the knn_state row
 * lock orders concurrent writers, so a version a reader sees covers every commit before it.
 */
export async function bumpKnnVersion(tx: DbOrTx, projectId: number): Promise<number> {
  const res = await tx.execute<{ version: string }>(sql`
    insert into knn_state (project_id, version, labels_since_pool_rank) values (${projectId}, 2, 1)
    on conflict (project_id) do update set version = knn_state.version + 1,
      labels_since_pool_rank = knn_state.labels_since_pool_rank + 1, updated_at = now()
    returning version::text as version`);
  return Number(res.rows[0].version);
}
