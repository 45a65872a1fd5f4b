import { availableParallelism, tmpdir } from "node:os";
import { mkdtempSync, rmSync } from "node:fs";
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import { HNSW_THRESHOLD, HnswIndex, defaultHnswParams, type HnswParams } from "./hnsw-index";
import { ClusterIndex } from "./cluster-index";
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
   * auto: exact scan below HNSW_THRESHOLD voters; above it, exact search with cluster pruning when
   * a probe of the pool shows it scans ≤ CLUSTERED_MAX_SCAN of the voters, HNSW otherwise.
   */
  method?: "auto" | PoolMethod;
  /** Worker threads (default: available cores); 0 = run in this thread. */
  threads?: number;
  hnsw?: Partial<HnswParams>;
  onProgress?: (message: string) => void;
  /** Called with the index the pool is searched with (not for plain exact), e.g. to measure its recall. */
  onIndex?: (index: HnswIndex | ClusterIndex) => void;
}

/** Largest mean fraction of voters a cluster-pruned query may scan for `auto` to pick it. */
export const CLUSTERED_MAX_SCAN = 0.15;

export interface PoolRanking extends PoolOutputs {
  method: PoolMethod;
  /** Mean fraction of voters scanned per query in the auto probe (when a cluster index was built). */
  probeScanFraction?: number;
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
    options.onProgress?.(`cluster index: ${clusters.parts.lists} lists; a query scans ${(100 * probeScanFraction).toFixed(1)}% of the voters`);
    if (auto) method = probeScanFraction <= CLUSTERED_MAX_SCAN || metric === "manhattan" ? "clustered" : "hnsw";
  }
  let dir: string | undefined;
  let indexPath: string | undefined;
  if (method === "hnsw") {
    options.onProgress?.(`building HNSW over ${keep.length} voters (M ${params.m}, efConstruction ${params.efConstruction})`);
    const index = HnswIndex.build(vectors, dim, ids, classes, metric, params);
    options.onIndex?.(index);
    dir = mkdtempSync(join(tmpdir(), "vicinal-hnsw-"));
    indexPath = join(dir, "index.bin");
    index.save(indexPath);
  }
  if (method === "clustered" && clusters) options.onIndex?.(clusters);
  const t1 = performance.now();
  const base = {
    method, dim, numClasses: C, k, metric, weighting: options.weighting ?? "uniform",
    labelledVectors: vectors, labelledIds: ids, labelledClasses: classes,
    pool: shared(pool), indexPath, ef: params.ef, out, clusters: method === "clustered" ? clusters?.parts : undefined,
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
  return { method, probeScanFraction, numClasses: C, buildSeconds: (t1 - t0) / 1000, searchSeconds: (t2 - t1) / 1000, ...out };
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
