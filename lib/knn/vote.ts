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
  const totals = new Float64Array(numClasses);
  let duplicates = false;
  if (weighting === "inverse") {
    for (const n of neighbours) if (n.classIndex >= 0 && n.distance === 0) duplicates = true;
  }
  let sum = 0;
  for (const n of neighbours) {
    const c = n.classIndex;
    if (c < 0) continue;
    if (c >= numClasses) throw new RangeError(`class index ${c} outside the label set of ${numClasses}`);
    let w = 1;
    if (weighting === "inverse") w = duplicates ? (n.distance === 0 ? 1 : 0) : 1 / n.distance;
    totals[c] += w;
    sum += w;
  }
  if (sum === 0) return { top: -1, shares: totals };
  let best = 0;
  for (let c = 0; c < numClasses; c += 1) if (totals[c] > best) best = totals[c];
  const floor = best * (1 - TIE_TOLERANCE);
  let top = -1;
  for (const n of neighbours) {
    if (n.classIndex >= 0 && totals[n.classIndex] >= floor && totals[n.classIndex] > 0) {
      top = n.classIndex;
      break;
    }
  }
  for (let c = 0; c < numClasses; c += 1) totals[c] /= sum;
  return { top, shares: totals };
}
