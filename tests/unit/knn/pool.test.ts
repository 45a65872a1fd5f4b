import { describe, expect, it } from "vitest";
import { ExactIndex, computeMap, mulberry32 } from "@/lib/knn";
import { HnswIndex, measureRecall } from "@/lib/knn/hnsw-index";
import { rankPool } from "@/lib/knn/pool";

/** Seeded Gaussian mixture (Box–Muller), 6 components, class = component % 3. */
function mixture(n: number, d: number, seed: number) {
  const r = mulberry32(seed);
  const g = () => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
  const centres = Array.from({ length: 6 }, () => Array.from({ length: d }, () => 4 * g()));
  const x = new Float32Array(n * d);
  const classes = new Int32Array(n);
  for (let i = 0; i < n; i += 1) {
    const c = Math.floor(r() * 6);
    classes[i] = c % 3;
    for (let j = 0; j < d; j += 1) x[i * d + j] = centres[c][j] + g();
  }
  return { x, classes };
}

describe("pool ranking", () => {
  const d = 8;
  const { x, classes } = mixture(2600, d, 5);
  const labelled = { vectors: x.subarray(0, 2000 * d), dim: d, classes: classes.subarray(0, 2000), numClasses: 3 };
  const pool = x.slice(2000 * d);

  it("two worker threads give the same result as this thread (exact search)", async () => {
    const one = await rankPool({ labelled, pool, k: 7, threads: 0, weighting: "inverse" });
    const two = await rankPool({ labelled, pool, k: 7, threads: 2, weighting: "inverse" });
    expect(two.method).toBe("exact");
    expect(Array.from(two.top)).toEqual(Array.from(one.top));
    expect(Array.from(two.shares)).toEqual(Array.from(one.shares));
    expect(Array.from(two.margin)).toEqual(Array.from(one.margin));
    // shares of row 0 sum to 1; least confident = 1 − top share.
    const s0 = Array.from(one.shares.subarray(0, 3));
    expect(s0.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 6);
    expect(one.leastConfident[0]).toBeCloseTo(1 - Math.max(...s0), 6);
  }, 20_000);

  it("the cluster-pruned exact method in workers equals plain exact search", async () => {
    const exact = await rankPool({ labelled, pool, k: 7, threads: 0, method: "exact" });
    const clustered = await rankPool({ labelled, pool, k: 7, threads: 2, method: "clustered" });
    expect(clustered.method).toBe("clustered");
    expect(Array.from(clustered.top)).toEqual(Array.from(exact.top));
    expect(Array.from(clustered.shares)).toEqual(Array.from(exact.shares));
  }, 20_000);

  it("batched and one-row-at-a-time workers give identical results (exact euclidean, clustered euclidean and cosine)", async () => {
    for (const [method, distance] of [["exact", "euclidean"], ["clustered", "euclidean"], ["clustered", "cosine"]] as const) {
      const slow = await rankPool({ labelled, pool, k: 9, threads: 0, method, distance, weighting: "inverse", batched: false });
      const fast = await rankPool({ labelled, pool, k: 9, threads: 2, method, distance, weighting: "inverse" });
      expect(fast.method).toBe(method);
      expect(Array.from(fast.top)).toEqual(Array.from(slow.top));
      expect(Array.from(fast.shares)).toEqual(Array.from(slow.shares));
      expect(Array.from(fast.entropy)).toEqual(Array.from(slow.entropy));
    }
  }, 20_000);

  it("auto meets recall@10 ≥ 0.98 when it picks HNSW: ef is raised from a too-small start", async () => {
    // Uniform rows (no cluster structure), HNSW forced by a zero cost estimate, ef 1 to start.
    const r = mulberry32(21);
    const dim = 6;
    const n = 20_000;
    const vectors = Float32Array.from({ length: n * dim }, () => r());
    const cls = Int32Array.from({ length: n }, (_, i) => i % 3);
    const rows = Float32Array.from({ length: 400 * dim }, () => r());
    const messages: string[] = [];
    const ranked = await rankPool({
      labelled: { vectors, dim, classes: cls, numClasses: 3 }, pool: rows, k: 10, threads: 0,
      hnsw: { m: 8, efConstruction: 40, ef: 1 }, autoCost: { hnswQueryPairs: 0, hnswBuildPairsPerVoter: 0 },
      onProgress: (m) => messages.push(m),
    });
    expect(ranked.recallAt10).toBeGreaterThanOrEqual(0.98);
    if (ranked.method === "hnsw") expect(ranked.ef).toBeGreaterThan(1);
    expect(messages.some((m) => m.startsWith("HNSW ef 1: recall@10"))).toBe(true);
  }, 20_000);

  it("HNSW recall@10 against exact search on a small set, and an HNSW pool run in workers", async () => {
    const ids = Int32Array.from({ length: 2000 }, (_, i) => i);
    const hnsw = HnswIndex.build(labelled.vectors, d, ids, Int32Array.from(labelled.classes), "euclidean", { ef: 64 });
    const exact = ExactIndex.from(labelled.vectors, d, labelled.classes);
    const recall = measureRecall(hnsw, exact, pool.subarray(0, 100 * d), 10);
    expect(recall).toBeGreaterThanOrEqual(0.95);
    const ranked = await rankPool({ labelled, pool, k: 7, threads: 2, method: "hnsw" });
    const exactRanked = await rankPool({ labelled, pool, k: 7, threads: 0, method: "exact" });
    expect(ranked.method).toBe("hnsw");
    let same = 0;
    for (let i = 0; i < 600; i += 1) if (ranked.top[i] === exactRanked.top[i]) same += 1;
    expect(same).toBeGreaterThanOrEqual(590);
  }, 20_000);
});

describe("map", () => {
  it("projects with PCA, samples as stated, and votes on the grid in the plane", () => {
    const { x, classes } = mixture(3000, 5, 9);
    const map = computeMap({ vectors: x, dim: 5, classes, numClasses: 3 }, { k: 5, gridSize: 10, maxPoints: 500, fitSample: 1000 });
    expect(map.points.length).toBe(500);
    expect(map.grid.cells.length).toBe(100);
    expect(map.sampling).toContain("PCA fitted on 1000 of 3000 rows");
    expect(map.explainedVariance[0]).toBeGreaterThanOrEqual(map.explainedVariance[1]);
    for (const cell of map.grid.cells) {
      expect(cell.classIndex).toBeGreaterThanOrEqual(0);
      expect(cell.topShare).toBeGreaterThanOrEqual(1 / 3);
    }
    // A labelled point's own grid cell mostly agrees with a 5-NN vote in the plane at that point.
    expect(map.method).toContain("projected plane");
  });
});
