import { COSINE_ZERO, manhattan, normaliseInto, partialScore, squaredEuclidean } from "./distance";
import { mulberry32 } from "./scores";
import { TopK } from "./top-k";
import type { Distance, Neighbour } from "./types";

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

const SLACK = 1e-9;

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
    const counts = new Int32Array(C + 1);
    for (let i = 0; i < n; i += 1) {
      assign[i] = nearestCentroid(rows, i * dim, centroids, C, dim);
      counts[assign[i] + 1] += 1;
    }
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
        if (dc[c] - radius[c] > kth * (1 + SLACK) + SLACK) continue;
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

function reported(metric: Distance, s: number): number {
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

function nearestCentroid(rows: Float32Array, ro: number, centroids: Float32Array, C: number, d: number): number {
  let best = 0;
  let bestS = Infinity;
  for (let c = 0; c < C; c += 1) {
    const s = partialScoreAt(centroids, c * d, rows, ro, d, bestS);
    if (s < bestS) {
      bestS = s;
      best = c;
    }
  }
  return best;
}

/** partialScore with the second row at an offset (squared L2, abandoned past `bound`). */
function partialScoreAt(a: Float32Array, ao: number, b: Float32Array, bo: number, d: number, bound: number): number {
  let s = 0;
  for (let j = 0; j < d; j += 8) {
    const end = Math.min(d, j + 8);
    for (let t = j; t < end; t += 1) {
      const x = a[ao + t] - b[bo + t];
      s += x * x;
    }
    if (s > bound) return Infinity;
  }
  return s;
}

/** Lloyd's k-means on a seeded sample, seeded with k-means++ (Arthur & Vassilvitskii 2007). */
function kMeans(rows: Float32Array, d: number, n: number, C: number, sampleSize: number, iterations: number, seed: number): Float32Array {
  const rand = mulberry32(seed);
  const m = Math.min(n, Math.max(sampleSize, C));
  const pick = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = 0; i < m; i += 1) {
    const j = i + Math.floor(rand() * (n - i));
    const t = pick[i];
    pick[i] = pick[j];
    pick[j] = t;
  }
  const sample = new Float32Array(m * d);
  for (let i = 0; i < m; i += 1) sample.set(rows.subarray(pick[i] * d, (pick[i] + 1) * d), i * d);
  const centroids = new Float32Array(C * d);
  const nearest = new Float64Array(m).fill(Infinity);
  let chosen = Math.floor(rand() * m);
  for (let c = 0; c < C; c += 1) {
    centroids.set(sample.subarray(chosen * d, (chosen + 1) * d), c * d);
    let total = 0;
    for (let i = 0; i < m; i += 1) {
      const s = squaredEuclidean(sample, i * d, centroids, c * d, d);
      if (s < nearest[i]) nearest[i] = s;
      total += nearest[i];
    }
    let target = rand() * total;
    chosen = m - 1;
    for (let i = 0; i < m; i += 1) {
      target -= nearest[i];
      if (target <= 0) {
        chosen = i;
        break;
      }
    }
  }
  const sums = new Float64Array(C * d);
  const counts = new Int32Array(C);
  for (let it = 0; it < iterations; it += 1) {
    sums.fill(0);
    counts.fill(0);
    for (let i = 0; i < m; i += 1) {
      const c = nearestCentroid(sample, i * d, centroids, C, d);
      counts[c] += 1;
      for (let j = 0; j < d; j += 1) sums[c * d + j] += sample[i * d + j];
    }
    for (let c = 0; c < C; c += 1) {
      if (counts[c] === 0) continue;
      for (let j = 0; j < d; j += 1) centroids[c * d + j] = sums[c * d + j] / counts[c];
    }
  }
  return centroids;
}
