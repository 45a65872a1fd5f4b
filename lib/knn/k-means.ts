import * as kernel from "./batch-kernel";
import * as distance from "./distance";
import { mulberry32 } from "./scores";

// Module-local copies: the CommonJS output reads imported bindings through getters, too slow per row.
const { BLOCK, dotBlock, squaredNorm, transposeBlock } = kernel;
const { squaredEuclidean } = distance;

/**
 * assign[i] = the centroid nearest to row i in squared L2, from the dot-product form
 * ‖c‖² − 2 r·c (‖r‖² is the same for every centroid), BLOCK rows at a time. Rounding can only
 * pick a near-tie differently; any assignment is valid for the index (radii are measured after).
 */
export function assignNearest(rows: Float32Array, n: number, dim: number, centroids: Float32Array, C: number, assign: Int32Array): void {
  const cn = new Float64Array(C);
  for (let c = 0; c < C; c += 1) cn[c] = squaredNorm(centroids, c, dim);
  const qt = new Float64Array(dim * BLOCK);
  const dots = new Float64Array(C * BLOCK);
  const block = new Int32Array(BLOCK);
  for (let i = 0; i < n; i += BLOCK) {
    for (let b = 0; b < BLOCK; b += 1) block[b] = Math.min(i + b, n - 1);
    transposeBlock(rows, block, dim, qt);
    dotBlock(centroids, 0, C, dim, qt, dots);
    for (let b = 0; b < BLOCK && i + b < n; b += 1) {
      let best = 0;
      let bestS = Infinity;
      for (let c = 0; c < C; c += 1) {
        const s = cn[c] - 2 * dots[c * BLOCK + b];
        if (s < bestS) {
          bestS = s;
          best = c;
        }
      }
      assign[i + b] = best;
    }
  }
}

/** Lloyd's k-means on a seeded sample, seeded with k-means++ (Arthur & Vassilvitskii 2007). */
export function kMeans(rows: Float32Array, d: number, n: number, C: number, sampleSize: number, iterations: number, seed: number): Float32Array {
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
  const assign = new Int32Array(m);
  for (let it = 0; it < iterations; it += 1) {
    sums.fill(0);
    counts.fill(0);
    assignNearest(sample, m, d, centroids, C, assign);
    for (let i = 0; i < m; i += 1) {
      const c = assign[i];
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
