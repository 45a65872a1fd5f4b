/** Ordering scores from vote shares; a larger score = more worth a human's time, except margin. */
export const orderings = ["leastConfident", "margin", "entropy"] as const;
export type Ordering = (typeof orderings)[number];

/** 1 − top share. */
export function leastConfident(shares: ArrayLike<number>): number {
  let top = 0;
  for (let c = 0; c < shares.length; c += 1) if (shares[c] > top) top = shares[c];
  return 1 - top;
}

/** Top share − second share (smaller = more split = earlier). */
export function margin(shares: ArrayLike<number>): number {
  let a = 0;
  let b = 0;
  for (let c = 0; c < shares.length; c += 1) {
    const s = shares[c];
    if (s > a) {
      b = a;
      a = s;
    } else if (s > b) b = s;
  }
  return a - b;
}

/** Shannon entropy of the shares, natural log (0 · ln 0 = 0). */
export function entropy(shares: ArrayLike<number>): number {
  let h = 0;
  for (let c = 0; c < shares.length; c += 1) if (shares[c] > 0) h -= shares[c] * Math.log(shares[c]);
  return h;
}

/**
 * Positions 0..n−1 in work order for one ordering: leastConfident and entropy descending, margin
 * ascending; equal scores → lower item id first.
 */
export function orderByScore(scores: ArrayLike<number>, ids: ArrayLike<number>, ordering: Ordering): Int32Array {
  const idx = Int32Array.from({ length: scores.length }, (_, i) => i);
  const sign = ordering === "margin" ? 1 : -1;
  return idx.sort((a, b) => sign * (scores[a] - scores[b]) || ids[a] - ids[b]);
}

/** Seeded random order (mulberry32 + Fisher–Yates): same seed, same order. */
export function randomOrder(n: number, seed: number): Int32Array {
  const rand = mulberry32(seed);
  const idx = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i -= 1) {
    const j = Math.floor(rand() * (i + 1));
    const t = idx[i];
    idx[i] = idx[j];
    idx[j] = t;
  }
  return idx;
}

/** mulberry32 pseudo-random generator (public-domain algorithm by Tommy Ettinger). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
