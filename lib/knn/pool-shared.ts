import { ClusterIndex, type ClusterParts } from "./cluster-index";
import { ExactIndex } from "./exact-index";
import { HnswIndex } from "./hnsw-index";
import { entropy, leastConfident, margin } from "./scores";
import type { Distance, Neighbour, Weighting } from "./types";
import { voteInto } from "./vote";
import { ClusterBatchSearcher } from "./cluster-batch";

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
  /** false = one query at a time (the pre-batching path, kept for comparison); default true. */
  batched?: boolean;
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
  const totals = new Float64Array(numClasses);
  const write = (i: number, count: number, classes: ArrayLike<number>, distances: ArrayLike<number>) => {
    out.top[i] = voteInto(classes, distances, count, numClasses, weighting, totals);
    out.shares.set(totals, i * numClasses);
    out.leastConfident[i] = leastConfident(totals);
    out.margin[i] = margin(totals);
    out.entropy[i] = entropy(totals);
  };
  const batched = batchedParts(task);
  if (batched) {
    new ClusterBatchSearcher(batched).searchAll(task.pool, k, (i, count, _ids, classes, distances) => write(i, count, classes, distances), task.start, task.end);
    return;
  }
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
  const classes = new Int32Array(k);
  const distances = new Float64Array(k);
  for (let i = task.start; i < task.end; i += 1) {
    const found = search(task.pool.subarray(i * dim, (i + 1) * dim));
    for (let j = 0; j < found.length; j += 1) {
      classes[j] = found[j].classIndex;
      distances[j] = found[j].distance;
    }
    write(i, found.length, classes, distances);
  }
}

/**
 * The parts the batched search runs on, when it applies: clustered (euclidean or cosine), and
 * plain exact euclidean as one list that is never pruned (the same sums as ExactIndex's scan).
 * Exact cosine keeps ExactIndex (it ranks by 1 − a·b, whose rounding differs from ‖a − b‖²/2).
 */
function batchedParts(task: PoolTask): ClusterParts | undefined {
  if (task.batched === false || task.metric === "manhattan") return undefined;
  if (task.method === "clustered") return task.clusters;
  if (task.method !== "exact" || task.metric !== "euclidean") return undefined;
  const n = task.labelledIds.length;
  return {
    dim: task.dim, metric: task.metric, lists: 1, centroids: new Float32Array(task.dim),
    radius: Float64Array.of(Infinity), offsets: Int32Array.of(0, n),
    data: task.labelledVectors.subarray(0, n * task.dim), ids: task.labelledIds, classes: task.labelledClasses,
  };
}
