import * as distance from "./distance";
import { assignNearest, kMeans } from "./k-means";
import { TopK } from "./top-k";
import type { Distance, Neighbour } from "./types";

// Module-local copies: the CommonJS output reads imported bindings through getters, too slow per row.
const { COSINE_ZERO, manhattan, normaliseInto, partialScore, squaredEuclidean } = distance;

/** Everything a ClusterIndex holds, in typed arrays (SharedArrayBuffer-backed when built with shared = true). */
export interface ClusterParts {
  dim: number;
  metric: Distance;
  lists: number;
  centroids: Float32Array;
  /** Largest member-to-centroid distance per list (triangle-inequality pruning). */
  radius: Float64Array;
  /** Rows of list c are [offsets[c], offsets[c + 1]). */
  offsets: Int32Array;
  data: Float32Array;
  ids: Int32Array;
  classes: Int32Array;
}

/** Relative and absolute allowance for rounding in the pruning test. */
export const CLUSTER_SLACK = 1e-9;

/**
 * Exact k-NN with cluster pruning: voters are grouped by k-means (√n lists); a query scans lists
 * nearest-centroid first and skips a list when d(q, centroid) − radius > current k-th distance
 * (triangle inequality, so no true neighbour is skipped). Results equal ExactIndex's, including
 * the tie rule; speed depends on how clustered the data are (`lastScanned` tells).
 * Cosine is searched as Euclidean on unit vectors (‖a − b‖² = 2 − 2 cos), reported as 1 − cos.
 */
export class ClusterIndex {
  readonly parts: ClusterParts;
  lastScanned = 0;
  private readonly l1: boolean;
  private readonly q: Float32Array;
  private readonly dc: Float64Array;

  constructor(parts: ClusterParts) {
    this.parts = parts;
    this.l1 = parts.metric === "manhattan";
    this.q = new Float32Array(parts.dim);
    this.dc = new Float64Array(parts.lists);
  }

  get size(): number {
    return this.parts.ids.length;
  }

  static build(
    vectors: Float32Array, dim: number, ids: ArrayLike<number>, classes: ArrayLike<number>, metric: Distance,
    options: { lists?: number; sample?: number; iterations?: number; seed?: number; shared?: boolean } = {},
  ): ClusterIndex {
    const n = ids.length;
    const alloc = (bytes: number) => (options.shared ? new SharedArrayBuffer(bytes) : new ArrayBuffer(bytes));
    const rows = new Float32Array(n * dim);
    rows.set(vectors.subarray(0, n * dim));
    if (metric === "cosine") for (let i = 0; i < n; i += 1) normaliseInto(rows, i * dim, dim, rows, i * dim);
    const C = Math.max(1, Math.min(n, options.lists ?? Math.round(Math.sqrt(n))));
    const centroids = kMeans(rows, dim, n, C, options.sample ?? 10_000, options.iterations ?? 5, options.seed ?? 1);
    const assign = new Int32Array(n);
    assignNearest(rows, n, dim, centroids, C, assign);
    const counts = new Int32Array(C + 1);
    for (let i = 0; i < n; i += 1) counts[assign[i] + 1] += 1;
    const offsets = new Int32Array(alloc((C + 1) * 4));
    for (let c = 0; c < C; c += 1) offsets[c + 1] = offsets[c] + counts[c + 1];
    const fillAt = Int32Array.from(offsets.subarray(0, C));
    const data = new Float32Array(alloc(n * dim * 4));
    const outIds = new Int32Array(alloc(n * 4));
    const outClasses = new Int32Array(alloc(n * 4));
    const radius = new Float64Array(alloc(C * 8));
    const l1 = metric === "manhattan";
    for (let i = 0; i < n; i += 1) {
      const c = assign[i];
      const r = fillAt[c]++;
      data.set(rows.subarray(i * dim, (i + 1) * dim), r * dim);
      outIds[r] = ids[i];
      outClasses[r] = classes[i];
      const dist = pairDistance(rows, i * dim, centroids, c * dim, dim, l1);
      if (dist > radius[c]) radius[c] = dist;
    }
    const shared = new Float32Array(alloc(centroids.byteLength));
    shared.set(centroids);
    return new ClusterIndex({ dim, metric, lists: C, centroids: shared, radius, offsets, data, ids: outIds, classes: outClasses });
  }

  /** The k nearest voters, nearest first (equal distances → lower id first). */
  search(query: ArrayLike<number>, k: number, excludeId?: number): Neighbour[] {
    const { dim, lists, centroids, radius, offsets, data, ids, classes, metric } = this.parts;
    const q = this.q;
    for (let j = 0; j < dim; j += 1) q[j] = query[j];
    if (metric === "cosine") normaliseInto(q, 0, dim, q, 0);
    const l1 = this.l1;
    const dc = this.dc;
    let first = 0;
    for (let c = 0; c < lists; c += 1) {
      dc[c] = l1 ? manhattan(q, 0, centroids, c * dim, dim) : Math.sqrt(squaredEuclidean(q, 0, centroids, c * dim, dim));
      if (dc[c] < dc[first]) first = c;
    }
    const top = new TopK(Math.min(k, ids.length));
    const exclude = excludeId ?? Number.NaN;
    let scanned = 0;
    // The nearest list first (it sets a tight k-th distance), then every other list not pruned.
    for (let oi = -1; oi < lists; oi += 1) {
      const c = oi < 0 ? first : oi;
      if (oi === first) continue;
      if (top.size === top.k && top.k > 0) {
        const kth = l1 ? top.bound : Math.sqrt(top.bound);
        if (dc[c] - radius[c] > kth * (1 + CLUSTER_SLACK) + CLUSTER_SLACK) continue;
      }
      const end = offsets[c + 1];
      for (let r = offsets[c]; r < end; r += 1) {
        if (classes[r] < 0 || ids[r] === exclude) continue;
        const s = partialScore(data, r * dim, q, dim, l1, top.bound);
        if (s <= top.bound) top.push(s, ids[r], r);
      }
      scanned += end - offsets[c];
    }
    this.lastScanned = scanned;
    return top.sorted().map((e) => ({ id: e.id, classIndex: classes[e.row], distance: reported(metric, e.distance) }));
  }
}

/** The reported distance of an internal score (squared L2 on unit rows for cosine). */
export function reported(metric: Distance, s: number): number {
  if (metric === "manhattan") return s;
  if (metric === "euclidean") return Math.sqrt(s);
  const cos = s / 2;
  return cos < COSINE_ZERO ? 0 : cos;
}

/** Euclidean (not squared) or L1 distance between two rows. */
function pairDistance(a: Float32Array, ao: number, b: Float32Array, bo: number, d: number, l1: boolean): number {
  let s = 0;
  for (let j = 0; j < d; j += 1) {
    const t = a[ao + j] - b[bo + j];
    s += l1 ? Math.abs(t) : t * t;
  }
  return l1 ? s : Math.sqrt(s);
}
