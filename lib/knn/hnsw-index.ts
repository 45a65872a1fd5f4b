import * as hnswModule from "hnswlib-node";
import type { HierarchicalNSW } from "hnswlib-node";
import type { ExactIndex } from "./exact-index";
import { COSINE_ZERO } from "./distance";
import type { Distance, Neighbour } from "./types";

/** Below this many voters the pool is ranked by exact search; at or above it, by HNSW. */
export const HNSW_THRESHOLD = 20_000;

export interface HnswParams {
  m: number;
  efConstruction: number;
  ef: number;
  seed: number;
}

/** Measured on 100 000 × 64 Gaussian-mixture rows: recall@10 ≥ 0.98 at ef 64 (see docs/knn.md). */
export const defaultHnswParams: HnswParams = { m: 16, efConstruction: 100, ef: 64, seed: 100 };

/**
 * Approximate search with hnswlib-node over the voting rows of a labelled set. The HNSW label of
 * a row is its position; `ids`/`classes` map it back. Euclidean and cosine only (hnswlib has no L1).
 */
export class HnswIndex {
  readonly dim: number;
  readonly metric: Distance;
  readonly native: HierarchicalNSW;
  readonly ids: Int32Array;
  readonly classes: Int32Array;

  private constructor(native: HierarchicalNSW, dim: number, metric: Distance, ids: Int32Array, classes: Int32Array) {
    this.native = native;
    this.dim = dim;
    this.metric = metric;
    this.ids = ids;
    this.classes = classes;
  }

  static build(vectors: Float32Array, dim: number, ids: Int32Array, classes: Int32Array, metric: Distance, params: Partial<HnswParams> = {}): HnswIndex {
    const p = { ...defaultHnswParams, ...params };
    const native = new hnswlib.HierarchicalNSW(spaceOf(metric), dim);
    const n = ids.length;
    native.initIndex(Math.max(1, n), p.m, p.efConstruction, p.seed);
    const row = new Array<number>(dim);
    for (let i = 0; i < n; i += 1) {
      for (let j = 0; j < dim; j += 1) row[j] = vectors[i * dim + j];
      native.addPoint(row, i);
    }
    native.setEf(p.ef);
    return new HnswIndex(native, dim, metric, ids, classes);
  }

  /** Loads an index written by `save`, with the same ids/classes it was built from. */
  static load(path: string, dim: number, ids: Int32Array, classes: Int32Array, metric: Distance, ef: number): HnswIndex {
    const native = new hnswlib.HierarchicalNSW(spaceOf(metric), dim);
    native.readIndexSync(path);
    native.setEf(ef);
    return new HnswIndex(native, dim, metric, ids, classes);
  }

  save(path: string): void {
    this.native.writeIndexSync(path);
  }

  setEf(ef: number): void {
    this.native.setEf(ef);
  }

  /** Approximate k nearest, re-sorted by (distance, id) so the exact tie rules apply to what was found. */
  search(query: ArrayLike<number>, k: number, excludeId?: number): Neighbour[] {
    const n = this.ids.length;
    const want = Math.min(n, excludeId === undefined ? k : k + 1);
    if (want === 0) return [];
    const q = Array.prototype.slice.call(query) as number[];
    const { neighbors, distances } = this.native.searchKnn(q, want);
    const out: Neighbour[] = [];
    for (let i = 0; i < neighbors.length; i += 1) {
      const row = neighbors[i];
      if (this.ids[row] === excludeId) continue;
      const raw = distances[i];
      const distance = this.metric === "euclidean" ? Math.sqrt(Math.max(0, raw)) : raw < COSINE_ZERO ? 0 : raw;
      out.push({ id: this.ids[row], classIndex: this.classes[row], distance });
    }
    out.sort((a, b) => a.distance - b.distance || a.id - b.id);
    return out.slice(0, k);
  }
}

// hnswlib-node is CommonJS whose exports Node's ESM loader cannot name: take them from `default`.
const hnswlib = ((hnswModule as unknown as { default?: typeof hnswModule }).default ?? hnswModule) as typeof hnswModule;

function spaceOf(metric: Distance): "l2" | "cosine" {
  if (metric === "euclidean") return "l2";
  if (metric === "cosine") return "cosine";
  throw new RangeError("HNSW supports euclidean and cosine distances only; use exact search for manhattan");
}

/** recall@k of `approx` against exact search: mean fraction of the exact k nearest ids found. */
export function measureRecall(approx: { search(q: ArrayLike<number>, k: number): Neighbour[] }, exact: ExactIndex, queries: Float32Array, k = 10): number {
  const d = exact.dim;
  const m = queries.length / d;
  if (m === 0) return 1;
  let found = 0;
  let total = 0;
  for (let i = 0; i < m; i += 1) {
    const q = queries.subarray(i * d, (i + 1) * d);
    const truth = exact.search(q, k);
    const got = new Set(approx.search(q, k).map((n) => n.id));
    for (const t of truth) if (got.has(t.id)) found += 1;
    total += truth.length;
  }
  return total > 0 ? found / total : 1;
}
