import { availableParallelism, tmpdir } from "node:os";
import { mkdtempSync, rmSync } from "node:fs";
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import { HNSW_THRESHOLD, HnswIndex, defaultHnswParams, type HnswParams } from "./hnsw-index";
import { ClusterIndex } from "./cluster-index";
import { ClusterBatchSearcher } from "./cluster-batch";
import { ExactIndex } from "./exact-index";
import { rankSlice, type PoolMethod, type PoolOutputs, type PoolTask } from "./pool-shared";
import type { LabelledSet } from "./tuning";
import type { Distance, Weighting } from "./types";

export interface RankPoolOptions {
  labelled: LabelledSet;
  /** Packed m × dim unlabelled rows, preprocessed like the labelled ones. */
  pool: Float32Array;
  k: number;
  distance?: Distance;
  weighting?: Weighting;
  /**
   * auto: exact scan below HNSW_THRESHOLD voters; above it, whichever of batched cluster-pruned
   * exact search and HNSW the cost model (probe of the pool, HNSW_QUERY_PAIRS…) finds cheaper,
   * HNSW only at a measured recall@10 ≥ RECALL_TARGET.
   */
  method?: "auto" | PoolMethod;
  /** Worker threads (default: available cores); 0 = run in this thread. */
  threads?: number;
  hnsw?: Partial<HnswParams>;
  /**
   * Search BLOCK pool rows at a time with the register-blocked kernel (default true; exact and
   * clustered, euclidean and cosine). false = one row at a time, as before batching; same results.
   */
  batched?: boolean;
  /** Overrides of the `auto` cost model (row distances; see HNSW_QUERY_PAIRS), e.g. after calibrating on other hardware. */
  autoCost?: { hnswQueryPairs?: number; hnswBuildPairsPerVoter?: number };
  onProgress?: (message: string) => void;
  /** Called with the index the pool is searched with (not for plain exact), e.g. to measure its recall. */
  onIndex?: (index: HnswIndex | ClusterIndex) => void;
}

/**
 * Kept for callers: the scan fraction above which the batched clustered search stops being the
 * cheaper one against HNSW on the benchmark data, (HNSW_QUERY_PAIRS − √n) / (1.2 n) at n = 100 000.
 * `auto` now compares the two cost estimates below directly.
 */
export const CLUSTERED_MAX_SCAN = 0.04;

/**
 * Cost model of `auto`, in row distances of the batched kernel (≈ 30 ns each for 64 dimensions
 * on the bench machine). HNSW (hnswlib-node, M 16, efConstruction 100, ef 64) measured there on
 * 100 000 × 64 rows: ≈ 150 µs of CPU per query and 18 s of CPU to build, i.e. ≈ 5 000 distances
 * per query and ≈ 6 000 per voter built (docs/knn.md). A batched block scans the union of its
 * queries' lists: 1.2 × what one query alone scans, measured.
 */
export const HNSW_QUERY_PAIRS = 5_000;
export const HNSW_BUILD_PAIRS_PER_VOTER = 6_000;
export const BLOCK_UNION_OVERHEAD = 1.2;
/** recall@10 that `auto` must reach; HNSW's is measured on RECALL_SAMPLE pool rows against exact search. */
export const RECALL_TARGET = 0.98;
const RECALL_SAMPLE = 200;
const RECALL_K = 10;
const MAX_AUTO_EF = 512;

export interface PoolRanking extends PoolOutputs {
  method: PoolMethod;
  /** Mean fraction of voters scanned per query in the auto probe (when a cluster index was built). */
  probeScanFraction?: number;
  /** recall@10 of HNSW against exact search on a pool sample, when `auto` built HNSW (1 if it then fell back to exact search). */
  recallAt10?: number;
  /** ef HNSW searched with (auto may raise it to meet RECALL_TARGET). */
  ef?: number;
  numClasses: number;
  buildSeconds: number;
  searchSeconds: number;
}

function shared<T extends Float32Array | Int32Array>(a: T): T {
  if (a.buffer instanceof SharedArrayBuffer) return a;
  const Ctor = a.constructor as { new (b: SharedArrayBuffer): T };
  const copy = new Ctor(new SharedArrayBuffer(a.byteLength));
  copy.set(a as never);
  return copy;
}

/**
 * Vote shares and ordering scores (least confident, margin, entropy) for every pool row, spread
 * over worker threads that read the vectors through SharedArrayBuffers and write results in place.
 */
export async function rankPool(options: RankPoolOptions): Promise<PoolRanking> {
  const { labelled, pool, k } = options;
  const metric = options.distance ?? "euclidean";
  const dim = labelled.dim;
  const m = pool.length / dim;
  if (!Number.isInteger(m)) throw new RangeError("pool.length is not a multiple of dim");
  // Only voters go into the index: non-voting rows are dropped here.
  const keep: number[] = [];
  for (let i = 0; i < labelled.classes.length; i += 1) if (labelled.classes[i] >= 0) keep.push(i);
  const ids = new Int32Array(new SharedArrayBuffer(keep.length * 4));
  const classes = new Int32Array(new SharedArrayBuffer(keep.length * 4));
  const vectors = new Float32Array(new SharedArrayBuffer(keep.length * dim * 4));
  keep.forEach((row, i) => {
    ids[i] = labelled.ids ? labelled.ids[row] : row;
    classes[i] = labelled.classes[row];
    vectors.set(labelled.vectors.subarray(row * dim, (row + 1) * dim), i * dim);
  });
  const C = labelled.numClasses;
  const out: PoolOutputs = {
    top: new Int32Array(new SharedArrayBuffer(m * 4)),
    shares: new Float32Array(new SharedArrayBuffer(m * C * 4)),
    leastConfident: new Float32Array(new SharedArrayBuffer(m * 4)),
    margin: new Float32Array(new SharedArrayBuffer(m * 4)),
    entropy: new Float32Array(new SharedArrayBuffer(m * 4)),
  };
  const params = { ...defaultHnswParams, ...options.hnsw };
  const t0 = performance.now();
  let method: PoolMethod = options.method === "auto" || options.method === undefined ? "exact" : options.method;
  let clusters: ClusterIndex | undefined;
  let probeScanFraction: number | undefined;
  const auto = (options.method ?? "auto") === "auto" && keep.length >= HNSW_THRESHOLD;
  if (auto || method === "clustered") {
    clusters = ClusterIndex.build(vectors, dim, ids, classes, metric, { shared: true });
    const probe = Math.min(m, 200);
    let scanned = 0;
    for (let i = 0; i < probe; i += 1) {
      clusters.search(pool.subarray(i * dim, (i + 1) * dim), k);
      scanned += clusters.lastScanned;
    }
    probeScanFraction = probe > 0 ? scanned / probe / Math.max(1, keep.length) : 0;
    const pairs = clusters.parts.lists + BLOCK_UNION_OVERHEAD * probeScanFraction * keep.length;
    const cost = options.autoCost ?? {};
    const hnswPairs = (cost.hnswQueryPairs ?? HNSW_QUERY_PAIRS) + ((cost.hnswBuildPairsPerVoter ?? HNSW_BUILD_PAIRS_PER_VOTER) * keep.length) / Math.max(1, m);
    options.onProgress?.(
      `cluster index: ${clusters.parts.lists} lists; a query scans ${(100 * probeScanFraction).toFixed(1)}% of the voters ` +
        `(≈ ${Math.round(pairs)} row distances per query batched; HNSW ≈ ${Math.round(hnswPairs)})`,
    );
    if (auto) method = metric === "manhattan" || pairs <= hnswPairs ? "clustered" : "hnsw";
  }
  let dir: string | undefined;
  let indexPath: string | undefined;
  let recallAt10: number | undefined;
  if (method === "hnsw") {
    options.onProgress?.(`building HNSW over ${keep.length} voters (M ${params.m}, efConstruction ${params.efConstruction})`);
    const index = HnswIndex.build(vectors, dim, ids, classes, metric, params);
    if (auto) {
      // auto must meet RECALL_TARGET: raise ef until a sample of the pool does, else search exactly.
      const sample = pool.subarray(0, Math.min(m, RECALL_SAMPLE) * dim);
      const exact = exactNeighbours(clusters, vectors, dim, ids, classes, metric, sample, RECALL_K);
      for (;;) {
        recallAt10 = recallAgainst(index, exact, sample, RECALL_K);
        options.onProgress?.(`HNSW ef ${params.ef}: recall@${RECALL_K} ${recallAt10.toFixed(4)} on ${sample.length / dim} pool rows`);
        if (recallAt10 >= RECALL_TARGET || params.ef >= MAX_AUTO_EF) break;
        params.ef *= 2;
        index.setEf(params.ef);
      }
      if (recallAt10 < RECALL_TARGET) {
        method = "clustered";
        recallAt10 = 1;
      }
    }
    if (method === "hnsw") {
      options.onIndex?.(index);
      dir = mkdtempSync(join(tmpdir(), "vicinal-hnsw-"));
      indexPath = join(dir, "index.bin");
      index.save(indexPath);
    }
  }
  if (method === "clustered" && clusters) options.onIndex?.(clusters);
  const t1 = performance.now();
  const base = {
    method, dim, numClasses: C, k, metric, weighting: options.weighting ?? "uniform",
    labelledVectors: vectors, labelledIds: ids, labelledClasses: classes,
    pool: shared(pool), indexPath, ef: params.ef, out, batched: options.batched, clusters: method === "clustered" ? clusters?.parts : undefined,
  } satisfies Omit<PoolTask, "start" | "end">;
  try {
    const threads = Math.min(options.threads ?? availableParallelism(), m);
    if (threads <= 0) rankSlice({ ...base, start: 0, end: m });
    else {
      const step = Math.ceil(m / threads);
      const jobs = [];
      for (let t = 0; t < threads; t += 1) jobs.push(runWorker({ ...base, start: t * step, end: Math.min(m, (t + 1) * step) }));
      await Promise.all(jobs);
    }
  } finally {
    if (dir) rmSync(dir, { recursive: true, force: true });
  }
  const t2 = performance.now();
  return { method, probeScanFraction, recallAt10, ef: method === "hnsw" ? params.ef : undefined, numClasses: C, buildSeconds: (t1 - t0) / 1000, searchSeconds: (t2 - t1) / 1000, ...out };
}

function runWorker(task: PoolTask): Promise<void> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(new URL("./pool-worker.cjs", import.meta.url), { workerData: task });
    let settled = false;
    worker.once("message", (msg: { ok: boolean; message?: string }) => {
      settled = true;
      if (msg.ok) resolve();
      else reject(new Error(`pool worker failed: ${msg.message}`));
      void worker.terminate();
    });
    worker.once("error", (error) => {
      settled = true;
      reject(error);
    });
    worker.once("exit", (code) => {
      if (!settled) reject(new Error(`pool worker exited with code ${code}`));
    });
  });
}

/** Exact k nearest ids of each sample row (batched clustered search when a cluster index exists). */
function exactNeighbours(
  clusters: ClusterIndex | undefined, vectors: Float32Array, dim: number, ids: Int32Array, classes: Int32Array, metric: Distance, sample: Float32Array, k: number,
): number[][] {
  if (clusters && metric !== "manhattan") return new ClusterBatchSearcher(clusters.parts).searchMany(sample, k).map((l) => l.map((n) => n.id));
  const exact = ExactIndex.from(vectors, dim, classes, metric, ids);
  const out: number[][] = [];
  for (let i = 0; i < sample.length / dim; i += 1) out.push(exact.search(sample.subarray(i * dim, (i + 1) * dim), k).map((n) => n.id));
  return out;
}

function recallAgainst(index: HnswIndex, truth: number[][], sample: Float32Array, k: number): number {
  let found = 0;
  let total = 0;
  truth.forEach((ids, i) => {
    const got = new Set(index.search(sample.subarray(i * index.dim, (i + 1) * index.dim), k).map((n) => n.id));
    for (const id of ids) if (got.has(id)) found += 1;
    total += ids.length;
  });
  return total > 0 ? found / total : 1;
}
