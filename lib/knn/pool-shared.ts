import { ClusterIndex, type ClusterParts } from "./cluster-index";
import { ExactIndex } from "./exact-index";
import { HnswIndex } from "./hnsw-index";
import { entropy, leastConfident, margin } from "./scores";
import type { Distance, Neighbour, Weighting } from "./types";
import { vote } from "./vote";

export type PoolMethod = "exact" | "clustered" | "hnsw";

/** What a pool worker gets: shared buffers plus the slice [start, end) of pool rows to rank. */
export interface PoolTask {
  method: PoolMethod;
  dim: number;
  numClasses: number;
  k: number;
  metric: Distance;
  weighting: Weighting;
  labelledVectors: Float32Array;
  labelledIds: Int32Array;
  labelledClasses: Int32Array;
  pool: Float32Array;
  start: number;
  end: number;
  indexPath?: string;
  ef?: number;
  clusters?: ClusterParts;
  out: PoolOutputs;
}

export interface PoolOutputs {
  top: Int32Array;
  /** n × numClasses vote shares. */
  shares: Float32Array;
  leastConfident: Float32Array;
  margin: Float32Array;
  entropy: Float32Array;
}

/** Ranks pool rows [start, end) into the output arrays (shared with the caller when run in a worker). */
export function rankSlice(task: PoolTask): void {
  const { dim, numClasses, k, metric, weighting, out } = task;
  let search: (q: Float32Array) => Neighbour[];
  if (task.method === "hnsw") {
    if (!task.indexPath) throw new Error("hnsw pool task without an index file");
    const index = HnswIndex.load(task.indexPath, dim, task.labelledIds, task.labelledClasses, metric, task.ef ?? 64);
    search = (q) => index.search(q, k);
  } else if (task.method === "clustered") {
    if (!task.clusters) throw new Error("clustered pool task without its cluster index");
    const index = new ClusterIndex(task.clusters);
    search = (q) => index.search(q, k);
  } else {
    const index = ExactIndex.from(task.labelledVectors, dim, task.labelledClasses, metric, task.labelledIds);
    search = (q) => index.search(q, k);
  }
  for (let i = task.start; i < task.end; i += 1) {
    const v = vote(search(task.pool.subarray(i * dim, (i + 1) * dim)), numClasses, weighting);
    out.top[i] = v.top;
    out.shares.set(v.shares, i * numClasses);
    out.leastConfident[i] = leastConfident(v.shares);
    out.margin[i] = margin(v.shares);
    out.entropy[i] = entropy(v.shares);
  }
}
