import type { Distance } from "./types";

/** Squared Euclidean distance between a[ao..ao+d) and b[bo..bo+d), four accumulators for speed. */
export function squaredEuclidean(a: Float32Array, ao: number, b: Float32Array, bo: number, d: number): number {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let j = 0;
  for (; j + 3 < d; j += 4) {
    const t0 = a[ao + j] - b[bo + j];
    const t1 = a[ao + j + 1] - b[bo + j + 1];
    const t2 = a[ao + j + 2] - b[bo + j + 2];
    const t3 = a[ao + j + 3] - b[bo + j + 3];
    s0 += t0 * t0;
    s1 += t1 * t1;
    s2 += t2 * t2;
    s3 += t3 * t3;
  }
  for (; j < d; j += 1) {
    const t = a[ao + j] - b[bo + j];
    s0 += t * t;
  }
  return s0 + s1 + (s2 + s3);
}

export function manhattan(a: Float32Array, ao: number, b: Float32Array, bo: number, d: number): number {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let j = 0;
  for (; j + 3 < d; j += 4) {
    s0 += Math.abs(a[ao + j] - b[bo + j]);
    s1 += Math.abs(a[ao + j + 1] - b[bo + j + 1]);
    s2 += Math.abs(a[ao + j + 2] - b[bo + j + 2]);
    s3 += Math.abs(a[ao + j + 3] - b[bo + j + 3]);
  }
  for (; j < d; j += 1) s0 += Math.abs(a[ao + j] - b[bo + j]);
  return s0 + s1 + (s2 + s3);
}

export function dot(a: Float32Array, ao: number, b: Float32Array, bo: number, d: number): number {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let j = 0;
  for (; j + 3 < d; j += 4) {
    s0 += a[ao + j] * b[bo + j];
    s1 += a[ao + j + 1] * b[bo + j + 1];
    s2 += a[ao + j + 2] * b[bo + j + 2];
    s3 += a[ao + j + 3] * b[bo + j + 3];
  }
  for (; j < d; j += 1) s0 += a[ao + j] * b[bo + j];
  return s0 + s1 + (s2 + s3);
}

/**
 * Writes the unit-length copy of v[vo..vo+d) into out[oo..). A zero vector stays zero, so its
 * cosine distance to anything is 1 (cosine similarity taken as 0).
 */
export function normaliseInto(v: Float32Array, vo: number, d: number, out: Float32Array, oo: number): void {
  const norm = Math.sqrt(dot(v, vo, v, vo, d));
  const f = norm > 0 ? 1 / norm : 0;
  for (let j = 0; j < d; j += 1) out[oo + j] = v[vo + j] * f;
}

/**
 * The "internal" score a scan ranks by (monotone in the distance): squared Euclidean,
 * Manhattan, or 1 − dot for unit-length rows (cosine). `toDistance` turns it into the reported distance.
 */
export function internalScore(metric: Distance, a: Float32Array, ao: number, b: Float32Array, bo: number, d: number): number {
  if (metric === "euclidean") return squaredEuclidean(a, ao, b, bo, d);
  if (metric === "manhattan") return manhattan(a, ao, b, bo, d);
  return 1 - dot(a, ao, b, bo, d);
}

/** Cosine distances below this are float32 rounding of unit vectors, reported as 0 (a duplicate). */
export const COSINE_ZERO = 1e-6;

export function toDistance(metric: Distance, score: number): number {
  if (metric === "euclidean") return Math.sqrt(score);
  if (metric === "cosine") return score < COSINE_ZERO ? 0 : score;
  return score;
}

/** Reported distance between two raw (not normalised) vectors. */
export function distanceBetween(metric: Distance, a: Float32Array, b: Float32Array): number {
  const d = a.length;
  if (metric === "cosine") {
    const na = Math.sqrt(dot(a, 0, a, 0, d));
    const nb = Math.sqrt(dot(b, 0, b, 0, d));
    if (na === 0 || nb === 0) return 1;
    return toDistance("cosine", 1 - dot(a, 0, b, 0, d) / (na * nb));
  }
  return toDistance(metric, internalScore(metric, a, 0, b, 0, d));
}

/** Squared L2 (or L1) of row vs q, abandoned (Infinity) once a partial sum exceeds
 * `bound`: every term is ≥ 0, so the sum only grows and no row that could enter the top k is lost. */
export function partialScore(a: Float32Array, ao: number, q: Float32Array, d: number, l1: boolean, bound: number): number {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let j = 0;
  while (j + 3 < d) {
    const stop = Math.min(d - 3, j + 16);
    if (l1) {
      for (; j < stop; j += 4) {
        s0 += Math.abs(a[ao + j] - q[j]);
        s1 += Math.abs(a[ao + j + 1] - q[j + 1]);
        s2 += Math.abs(a[ao + j + 2] - q[j + 2]);
        s3 += Math.abs(a[ao + j + 3] - q[j + 3]);
      }
    } else {
      for (; j < stop; j += 4) {
        const t0 = a[ao + j] - q[j];
        const t1 = a[ao + j + 1] - q[j + 1];
        const t2 = a[ao + j + 2] - q[j + 2];
        const t3 = a[ao + j + 3] - q[j + 3];
        s0 += t0 * t0;
        s1 += t1 * t1;
        s2 += t2 * t2;
        s3 += t3 * t3;
      }
    }
    if (s0 + s1 + (s2 + s3) > bound) return Infinity;
  }
  for (; j < d; j += 1) {
    const t = a[ao + j] - q[j];
    s0 += l1 ? Math.abs(t) : t * t;
  }
  return s0 + s1 + (s2 + s3);
}
