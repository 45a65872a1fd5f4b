import { ExactIndex, defaultKs, distances, evaluate, logLossSmoothing, mulberry32, vote, type Neighbour, type TuningResult } from "@/lib/knn";
import { ClusterIndex } from "@/lib/knn/cluster-index";
import type { Distance, Weighting } from "@/lib/knn";
import { loadProjectSet, votersOnly } from "./project-set";

/** Above this many voters, leave-one-out is evaluated on a seeded sample of this many query items (each still searches all other voters). */
export const TUNING_MAX_QUERIES = 5_000;
/** At or below this many voters the owner's request computes inline; above it a job runs. */
export const TUNING_INLINE_MAX = 1_500;
/** Voters above which the leave-one-out search uses the cluster-pruned exact index (same answers as the plain scan). */
const CLUSTER_FROM = 20_000;

export type TuningReport = {
  n: number;
  queries: number;
  sampled: boolean;
  sampling: string;
  ks: number[];
  distances: Distance[];
  weighting: Weighting;
  smoothing: string;
  classIds: number[];
  results: TuningResult[];
};

/**
 * Leave-one-out for every k (1..51 odd) and distance: one search of max(k) per query item (itself
 * excluded), every k read off the same list, scored with lib/knn's evaluate (accuracy, macro-F1,
 * smoothed log-loss, reliability with ECE).
 */
export async function computeTuning(projectId: number, options: { onProgress?: (p: number) => Promise<void> | void; ks?: number[] } = {}): Promise<{ report: TuningReport; knnVersion: number } | null> {
  const ps = await loadProjectSet(projectId, { includeNonVoters: false });
  if (!ps) return null;
  const set = votersOnly(ps);
  const n = set.classes.length;
  const ks = options.ks ?? defaultKs;
  const maxK = Math.max(...ks);
  const weighting = ps.state.settings.weighting;
  const queryRows = sampleRows(n, TUNING_MAX_QUERIES, 17);
  const truth = Array.from(queryRows, (r) => set.classes[r]);
  const metrics = [...distances] as Distance[];
  const results: TuningResult[] = [];
  for (let m = 0; m < metrics.length; m += 1) {
    const metric = metrics[m];
    const index =
      n >= CLUSTER_FROM ? ClusterIndex.build(set.vectors, set.dim, set.ids, set.classes, metric) : ExactIndex.from(set.vectors, set.dim, set.classes, metric, set.ids);
    const lists: Neighbour[][] = [];
    const chunk = 250;
    for (let q = 0; q < queryRows.length; q += 1) {
      const r = queryRows[q];
      const row = set.vectors.subarray(r * set.dim, (r + 1) * set.dim);
      lists.push(index instanceof ClusterIndex ? index.search(row, maxK, set.ids[r]) : index.search(row, maxK, { excludeId: set.ids[r] }));
      if ((q + 1) % chunk === 0) await options.onProgress?.((m + (q + 1) / queryRows.length) / metrics.length);
    }
    for (const k of ks) {
      const votes = lists.map((l) => vote(l.slice(0, k), set.numClasses, weighting));
      results.push({ k, distance: metric, ...evaluate(truth, votes, set.numClasses, 10) });
    }
    await options.onProgress?.((m + 1) / metrics.length);
  }
  const sampled = queryRows.length < n;
  return {
    knnVersion: ps.state.version,
    report: {
      n,
      queries: queryRows.length,
      sampled,
      sampling: sampled
        ? `leave-one-out on a seeded uniform sample of ${queryRows.length} of ${n} labelled items (seed 17); each is scored against all other ${n - 1}`
        : `leave-one-out on all ${n} labelled items`,
      ks,
      distances: metrics,
      weighting,
      smoothing: logLossSmoothing,
      classIds: ps.state.classIds,
      results,
    },
  };
}

/** Ascending positions of a seeded uniform sample of m of n rows (all when n ≤ m). */
export function sampleRows(n: number, m: number, seed: number): Int32Array {
  if (n <= m) return Int32Array.from({ length: n }, (_, i) => i);
  const rand = mulberry32(seed);
  const idx = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = 0; i < m; i += 1) {
    const j = i + Math.floor(rand() * (n - i));
    const t = idx[i];
    idx[i] = idx[j];
    idx[j] = t;
  }
  return idx.slice(0, m).sort();
}
