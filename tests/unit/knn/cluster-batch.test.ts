import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ExactIndex, TopK, mulberry32, vote } from "@/lib/knn";
import { BLOCK, dotBlock, transposeBlock } from "@/lib/knn/batch-kernel";
import { ClusterBatchSearcher } from "@/lib/knn/cluster-batch";
import { ClusterIndex } from "@/lib/knn/cluster-index";
import { voteInto } from "@/lib/knn/vote";

/** Seeded Gaussian blobs (Box–Muller); `round` snaps values to integers so many distances tie. */
function rows(n: number, d: number, seed: number, round: boolean, blobs = 8) {
  const r = mulberry32(seed);
  const g = () => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
  const centres = Array.from({ length: blobs }, () => Array.from({ length: d }, () => 5 * g()));
  const x = new Float32Array(n * d);
  for (let i = 0; i < n; i += 1) {
    const c = centres[i % blobs];
    for (let j = 0; j < d; j += 1) x[i * d + j] = round ? Math.round(c[j] + g()) : c[j] + g();
  }
  return x;
}

describe("ClusterBatchSearcher (blocked dot-product filter + exact re-score)", () => {
  for (const metric of ["euclidean", "cosine"] as const) {
    for (const round of [false, true]) {
      it(`${metric}${round ? ", integer rows with many ties" : ""}: equals the one-query searches exactly`, () => {
        const d = 12;
        const n = 1200;
        const nq = 43; // not a multiple of BLOCK: the last block is padded
        const x = rows(n + nq, d, 11, round);
        // Every 7th stored row does not vote: the batch must skip it as the scans do.
        const classes = Int32Array.from({ length: n }, (_, i) => (i % 7 === 0 ? -1 : i % 4));
        const ids = Int32Array.from({ length: n }, (_, i) => 3 * i + 1);
        const cluster = ClusterIndex.build(x.subarray(0, n * d), d, ids, classes, metric, { lists: 25 });
        const exact = ExactIndex.from(x.subarray(0, n * d), d, classes, metric, ids);
        const queries = x.slice(n * d);
        // chunkQueries 10: several chunks, so grouping restarts mid-run.
        const got = new ClusterBatchSearcher(cluster.parts, { chunkQueries: 10 }).searchMany(queries, 9);
        expect(got.length).toBe(nq);
        for (let q = 0; q < nq; q += 1) {
          const query = queries.subarray(q * d, (q + 1) * d);
          // Bit-for-bit the same as ClusterIndex (same sums); euclidean also as the plain exact scan.
          expect(got[q]).toEqual(cluster.search(query, 9));
          if (metric === "euclidean") expect(got[q]).toEqual(exact.search(query, 9));
          else if (!round) expect(got[q].map((m) => m.id)).toEqual(exact.search(query, 9).map((m) => m.id));
        }
      });
    }
  }

  it("a sub-range of queries, k above the number of voters, and k = 0", () => {
    const d = 5;
    const x = rows(60, d, 4, false, 3);
    const ids = Int32Array.from({ length: 40 }, (_, i) => i);
    const classes = Int32Array.from({ length: 40 }, (_, i) => i % 2);
    const cluster = ClusterIndex.build(x.subarray(0, 40 * d), d, ids, classes, "euclidean", { lists: 4 });
    const searcher = new ClusterBatchSearcher(cluster.parts);
    const seen: number[] = [];
    searcher.searchAll(x.subarray(40 * d), 50, (q, count, got) => {
      seen.push(q);
      expect(count).toBe(40);
      expect(Array.from(got.subarray(0, count)).sort((a, b) => a - b)).toEqual([...ids]);
    }, 3, 9);
    expect(seen.sort((a, b) => a - b)).toEqual([3, 4, 5, 6, 7, 8]);
    searcher.searchAll(x.subarray(40 * d), 0, (_q, count) => expect(count).toBe(0), 0, 2);
  });

  it("property: equals the exact scan for random sizes, list counts and k", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 300 }), fc.integer({ min: 1, max: 20 }), fc.integer({ min: 1, max: 15 }),
        fc.integer({ min: 1, max: 9 }), fc.integer({ min: 0, max: 1e6 }), fc.boolean(),
        (n, lists, k, d, seed, round) => {
          const x = rows(n + 9, d, seed, round, 5);
          const classes = Int32Array.from({ length: n }, (_, i) => i % 3);
          const ids = Int32Array.from({ length: n }, (_, i) => n - i);
          const cluster = ClusterIndex.build(x.subarray(0, n * d), d, ids, classes, "euclidean", { lists: Math.min(lists, n) });
          const exact = ExactIndex.from(x.subarray(0, n * d), d, classes, "euclidean", ids);
          const queries = x.slice(n * d);
          const got = new ClusterBatchSearcher(cluster.parts).searchMany(queries, k);
          for (let q = 0; q < 9; q += 1) expect(got[q]).toEqual(exact.search(queries.subarray(q * d, (q + 1) * d), k));
        },
      ),
      { numRuns: 60, seed: 7 },
    );
  });

  it("dotBlock: q·x for each of the four queries, including an odd last row", () => {
    const d = 3;
    const data = Float32Array.of(1, 2, 3, 4, 5, 6, 7, 8, 9);
    const queries = Float32Array.of(1, 0, 0, 0, 1, 0, 0, 0, 1, 1, 1, 1);
    const qt = new Float64Array(d * BLOCK);
    transposeBlock(queries, [0, 1, 2, 3], d, qt);
    const out = new Float64Array(3 * BLOCK);
    dotBlock(data, 0, 3, d, qt, out);
    // hand-computed: unit vectors pick single coordinates, (1,1,1) sums the row.
    expect(Array.from(out)).toEqual([1, 2, 3, 6, 4, 5, 6, 15, 7, 8, 9, 24]);
  });
});

describe("allocation-free helpers used by the pool workers", () => {
  it("TopK.sortedInto gives what sorted() gives, after reset too", () => {
    const r = mulberry32(3);
    const top = new TopK(6);
    for (let round = 0; round < 3; round += 1) {
      top.reset();
      for (let i = 0; i < 40; i += 1) top.push(Math.floor(r() * 8), Math.floor(r() * 1000), i);
      const dist = new Float64Array(6);
      const ids = new Int32Array(6);
      const rowsOut = new Int32Array(6);
      const count = top.sortedInto(dist, ids, rowsOut);
      const expected = top.sorted();
      expect(count).toBe(expected.length);
      expect(expected.map((e) => [e.distance, e.id, e.row])).toEqual(Array.from({ length: count }, (_, i) => [dist[i], ids[i], rowsOut[i]]));
    }
  });

  it("voteInto matches vote on a hand-computable case (inverse weights, vote tie → nearest)", () => {
    // class 0 at distances 1 and 4 → 1 + 0.25 = 1.25; class 1 at 2 and 4 → 0.5 + 0.25 = 0.75.
    const neighbours = [
      { id: 5, classIndex: 0, distance: 1 }, { id: 2, classIndex: 1, distance: 2 },
      { id: 9, classIndex: 1, distance: 4 }, { id: 1, classIndex: 0, distance: 4 },
    ];
    const totals = new Float64Array(3);
    const top = voteInto([0, 1, 1, 0], [1, 2, 4, 4], 4, 3, "inverse", totals);
    expect(top).toBe(0);
    expect(Array.from(totals)).toEqual([0.625, 0.375, 0]);
    const v = vote(neighbours, 3, "inverse");
    expect(v.top).toBe(top);
    expect(Array.from(v.shares)).toEqual(Array.from(totals));
    // uniform 2–2 tie: the nearest tied neighbour (class 0) wins.
    expect(voteInto([0, 1, 1, 0], [1, 2, 4, 4], 4, 3, "uniform", totals)).toBe(0);
    expect(Array.from(totals)).toEqual([0.5, 0.5, 0]);
  });
});
