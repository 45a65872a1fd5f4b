import type { Neighbour, Vote, Weighting } from "./types";

/** Class totals within this relative tolerance count as equal votes (float sums of 1/d). */
export const TIE_TOLERANCE = 1e-9;

/**
 * Votes of `neighbours` (nearest first, as search returns them) over `numClasses` classes.
 * - uniform: each voter counts 1.
 * - inverse: each voter counts 1/d; if any voter is at distance 0 (an exact duplicate), only the
 *   voters at distance 0 count, uniformly among themselves.
 * Neighbours with classIndex < 0 do not vote.
 * Tie rule: classes with equal totals → the class of the nearest tied neighbour (the first one in
 * the list order, i.e. smallest distance, then lowest item id). No voter → top −1, all shares 0.
 */
export function vote(neighbours: readonly Neighbour[], numClasses: number, weighting: Weighting = "uniform"): Vote {
  const n = neighbours.length;
  const classes = new Int32Array(n);
  const distances = new Float64Array(n);
  for (let i = 0; i < n; i += 1) {
    classes[i] = neighbours[i].classIndex;
    distances[i] = neighbours[i].distance;
  }
  const totals = new Float64Array(numClasses);
  const top = voteInto(classes, distances, n, numClasses, weighting, totals);
  return { top, shares: totals };
}

/**
 * `vote` over the first `count` neighbours given as parallel arrays (nearest first), writing the
 * shares into `totals` (length ≥ numClasses) and returning the top class: the allocation-free
 * form the pool workers call per row. Same rules as `vote`.
 */
export function voteInto(
  classes: ArrayLike<number>, distances: ArrayLike<number>, count: number, numClasses: number, weighting: Weighting, totals: Float64Array,
): number {
  totals.fill(0, 0, numClasses);
  let duplicates = false;
  if (weighting === "inverse") {
    for (let i = 0; i < count; i += 1) if (classes[i] >= 0 && distances[i] === 0) duplicates = true;
  }
  let sum = 0;
  for (let i = 0; i < count; i += 1) {
    const c = classes[i];
    if (c < 0) continue;
    if (c >= numClasses) throw new RangeError(`class index ${c} outside the label set of ${numClasses}`);
    let w = 1;
    if (weighting === "inverse") w = duplicates ? (distances[i] === 0 ? 1 : 0) : 1 / distances[i];
    totals[c] += w;
    sum += w;
  }
  if (sum === 0) return -1;
  let best = 0;
  for (let c = 0; c < numClasses; c += 1) if (totals[c] > best) best = totals[c];
  const floor = best * (1 - TIE_TOLERANCE);
  let top = -1;
  for (let i = 0; i < count; i += 1) {
    const c = classes[i];
    if (c >= 0 && totals[c] >= floor && totals[c] > 0) {
      top = c;
      break;
    }
  }
  for (let c = 0; c < numClasses; c += 1) totals[c] /= sum;
  return top;
}
