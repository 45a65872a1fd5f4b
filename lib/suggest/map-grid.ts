import { ExactIndex, randomOrder, vote, type ItemMap, type Weighting } from "@/lib/knn";

/** Ascending positions of a seeded sample of m of n rows (all when n ≤ m): lib/knn's map sampling rule. */
export function mapSample(n: number, m: number, seed: number): Int32Array {
  if (n <= m) return Int32Array.from({ length: n }, (_, i) => i);
  return randomOrder(n, seed).slice(0, m).sort();
}

/**
 * The Map's region grid for another k, from one computeMap answer that returned every point
 * (maxPoints ≥ n): the same voter sample (seed + 1, at most maxVoters), the same cell centres and
 * the same vote as lib/knn's computeMap, without fitting the PCA again for each k.
 */
export function gridForK(map: ItemMap, options: { k: number; numClasses: number; weighting: Weighting; maxVoters?: number; seed?: number }) {
  const voters = map.points.filter((p) => p.classIndex >= 0);
  const chosen = mapSample(voters.length, options.maxVoters ?? 20_000, (options.seed ?? 1) + 1);
  const plane = new ExactIndex(2, "euclidean", Math.max(1, chosen.length));
  for (const c of chosen) plane.upsert(voters[c].id, [voters[c].x, voters[c].y], voters[c].classIndex);
  const { size, xMin, xMax, yMin, yMax } = map.grid;
  const dx = (xMax - xMin) / size || 1;
  const dy = (yMax - yMin) / size || 1;
  const classIndex: number[] = [];
  const topShare: number[] = [];
  for (let gy = 0; gy < size; gy += 1) {
    for (let gx = 0; gx < size; gx += 1) {
      const v = vote(plane.search([xMin + (gx + 0.5) * dx, yMin + (gy + 0.5) * dy], options.k), options.numClasses, options.weighting);
      classIndex.push(v.top);
      topShare.push(v.top >= 0 ? v.shares[v.top] : 0);
    }
  }
  return { classIndex, topShare };
}
