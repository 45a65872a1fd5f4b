import { describe, expect, it } from "vitest";
import { ExactIndex, distanceBetween, mulberry32 } from "@/lib/knn";

function randomRows(n: number, d: number, seed: number): Float32Array {
  const r = mulberry32(seed);
  return Float32Array.from({ length: n * d }, () => Math.round(r() * 100) / 10);
}

/** Brute force with a full sort: the definition the index must match. */
function bruteForce(rows: Float32Array, d: number, ids: number[], q: Float32Array, k: number, metric: "euclidean" | "manhattan" | "cosine") {
  return ids
    .map((id, i) => ({ id, distance: distanceBetween(metric, rows.subarray(i * d, (i + 1) * d), q) }))
    .sort((a, b) => a.distance - b.distance || a.id - b.id)
    .slice(0, k);
}

describe("ExactIndex", () => {
  it("equal distances at the k-th place → lower item id wins", () => {
    // ids 30, 10, 20 all at distance 1 from the origin; k = 2 keeps 10 and 20.
    const index = new ExactIndex(2);
    index.upsert(30, [1, 0], 0);
    index.upsert(10, [0, 1], 0);
    index.upsert(20, [-1, 0], 1);
    index.upsert(40, [3, 0], 1);
    expect(index.search([0, 0], 2).map((n) => n.id)).toEqual([10, 20]);
  });

  it("excludeId: an item never votes for itself", () => {
    const index = ExactIndex.from(Float32Array.from([0, 0, 1, 1, 5, 5]), 2, [0, 1, 0]);
    expect(index.search([0, 0], 1)[0].id).toBe(0);
    expect(index.search([0, 0], 1, { excludeId: 0 })[0].id).toBe(1);
  });

  it("non-voting rows (class −1) are skipped unless asked for", () => {
    const index = ExactIndex.from(Float32Array.from([0, 0, 1, 1]), 2, [-1, 1]);
    expect(index.search([0, 0], 2).map((n) => n.id)).toEqual([1]);
    expect(index.search([0, 0], 2, { includeNonVoters: true }).map((n) => n.id)).toEqual([0, 1]);
  });

  it("k ≥ n returns every voter", () => {
    const index = ExactIndex.from(Float32Array.from([0, 0, 1, 1, 2, 2]), 2, [0, 1, 0]);
    expect(index.search([0, 0], 50).map((n) => n.id)).toEqual([0, 1, 2]);
    expect(index.search([0, 0], 0)).toEqual([]);
  });

  for (const metric of ["euclidean", "manhattan", "cosine"] as const) {
    it(`${metric}: incremental upserts, class changes and removals equal a rebuild and a brute-force sort`, () => {
      const d = 5;
      const rows = randomRows(300, d, 7);
      const index = new ExactIndex(d, metric, 2);
      for (let i = 0; i < 300; i += 1) index.upsert(i, rows.subarray(i * d, (i + 1) * d), i % 3);
      for (let i = 0; i < 300; i += 7) index.remove(i);
      for (let i = 1; i < 300; i += 11) if (i % 7 !== 0) index.setClass(i, -1);
      index.upsert(5, rows.subarray(0, d), 2);
      const liveIds: number[] = [];
      const live: number[] = [];
      const classes: number[] = [];
      for (let i = 0; i < 300; i += 1) {
        if (i % 7 === 0 || (i - 1) % 11 === 0) continue; // removed, or made a non-voter
        liveIds.push(i);
        live.push(...(i === 5 ? rows.subarray(0, d) : rows.subarray(i * d, (i + 1) * d)));
        classes.push(i === 5 ? 2 : i % 3);
      }
      const rebuilt = ExactIndex.from(Float32Array.from(live), d, classes, metric, liveIds);
      const q = randomRows(1, d, 99);
      const a = index.search(q, 9);
      expect(a).toEqual(rebuilt.search(q, 9));
      const expected = bruteForce(Float32Array.from(live), d, liveIds, q, 9, metric);
      expect(a.map((n) => n.id)).toEqual(expected.map((n) => n.id));
      a.forEach((n, i) => expect(n.distance).toBeCloseTo(expected[i].distance, 5));
      expect(index.size).toBe(300 - 43); // ids 0, 7, …, 294 removed; non-voters stay stored
    });
  }

  it("distances: euclidean 3-4-5, manhattan 7, cosine of orthogonal and opposite vectors", () => {
    const a = Float32Array.from([0, 0]);
    const b = Float32Array.from([3, 4]);
    expect(distanceBetween("euclidean", a, b)).toBe(5);
    expect(distanceBetween("manhattan", a, b)).toBe(7);
    expect(distanceBetween("cosine", Float32Array.from([1, 0]), Float32Array.from([0, 2]))).toBeCloseTo(1, 12);
    expect(distanceBetween("cosine", Float32Array.from([1, 1]), Float32Array.from([-2, -2]))).toBeCloseTo(2, 6);
    const cos = ExactIndex.from(Float32Array.from([10, 0, 0, 1, 1, 1]), 2, [0, 1, 0], "cosine");
    // cosine ignores length: (10, 0) is at distance 0 from (1, 0); (1, 1) at 1 − 1/√2.
    const found = cos.search([1, 0], 3);
    expect(found.map((n) => n.id)).toEqual([0, 2, 1]);
    expect(found[0].distance).toBe(0);
    expect(found[1].distance).toBeCloseTo(1 - Math.SQRT1_2, 6);
  });
});
