import { sql } from "drizzle-orm";
import type { DbOrTx } from "@/db";

/** knn_changes rows this many versions old are pruned (drizzle/0005); a process further behind rebuilds its index. */
export const CHANGE_LOG_KEEP = 20_000;

/**
 * Marks the votes of `itemIds` as changed. Each item gets a knn_changes row; when the transaction commits, a deferred
 * trigger raises knn_state.version by one per row and stamps the row with it (and counts the event towards the next
 * pool re-ranking). Every app process compares its cached version with knn_state.version before answering and reads
 * exactly the logged items above its own. Call inside the transaction that adds/undoes a label, sets a final label or
 * issues a ruling. The versions are given under the knn_state row lock at commit, so a version a reader sees covers
 * every commit before it, and writers of one project wait on each other only for their commits.
 */
export async function markKnnChanged(tx: DbOrTx, projectId: number, itemIds: readonly number[]): Promise<void> {
  if (!itemIds.every((id) => Number.isSafeInteger(id))) throw new Error("markKnnChanged: item ids must be integers");
  if (!itemIds.length) return;
  await tx.execute(sql`insert into knn_changes (project_id, item_id) select ${projectId}, unnest(${`{${itemIds.join(",")}}`}::int[])`);
}
