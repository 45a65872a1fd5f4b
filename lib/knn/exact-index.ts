import * as distance from "./distance";
import { TopK } from "./top-k";
import type { Distance, Neighbour } from "./types";

// Module-local copies: the CommonJS output reads imported bindings through getters, too slow per row.
const { COSINE_ZERO, dot, normaliseInto, partialScore, toDistance } = distance;

export interface SearchOptions {
  /** This item is skipped: an item never votes for itself. */
  excludeId?: number;
  /** Include rows whose class is −1 (default false: only voters are neighbours). */
  includeNonVoters?: boolean;
}

/**
 * Exact k-NN over packed Float32 rows, addressed by int32 item id. Rows live densely in
 * [0, size); remove() moves the last row into the hole (swap-remove), so no rebuild is needed.
 * Cosine rows are stored unit-length, so the scan is a dot product.
 */
export class ExactIndex {
  readonly dim: number;
  readonly metric: Distance;
  private data: Float32Array;
  private ids: Int32Array;
  private classes: Int32Array;
  private rowOf = new Map<number, number>();
  private count = 0;
  private readonly scratch: Float32Array;

  constructor(dim: number, metric: Distance = "euclidean", capacity = 1024) {
    if (!Number.isInteger(dim) || dim <= 0) throw new RangeError(`dim must be a positive integer, got ${dim}`);
    this.dim = dim;
    this.metric = metric;
    const cap = Math.max(1, capacity);
    this.data = new Float32Array(cap * dim);
    this.ids = new Int32Array(cap);
    this.classes = new Int32Array(cap);
    this.scratch = new Float32Array(dim);
  }

  /** Builds an index from packed rows; ids default to 0..n−1. */
  static from(
    vectors: Float32Array,
    dim: number,
    classes: ArrayLike<number>,
    metric: Distance = "euclidean",
    ids?: ArrayLike<number>,
  ): ExactIndex {
    const n = vectors.length / dim;
    if (!Number.isInteger(n)) throw new RangeError("vectors.length is not a multiple of dim");
    if (classes.length !== n) throw new RangeError(`classes has ${classes.length} entries for ${n} rows`);
    const index = new ExactIndex(dim, metric, n);
    for (let i = 0; i < n; i += 1) index.upsert(ids ? ids[i] : i, vectors.subarray(i * dim, (i + 1) * dim), classes[i]);
    return index;
  }

  get size(): number {
    return this.count;
  }

  has(id: number): boolean {
    return this.rowOf.has(id);
  }

  classOf(id: number): number | undefined {
    const row = this.rowOf.get(id);
    return row === undefined ? undefined : this.classes[row];
  }

  /** A copy of the stored row (unit-length for cosine). */
  vectorOf(id: number): Float32Array | undefined {
    const row = this.rowOf.get(id);
    return row === undefined ? undefined : this.data.slice(row * this.dim, (row + 1) * this.dim);
  }

  private grow(): void {
    const cap = this.ids.length * 2;
    const data = new Float32Array(cap * this.dim);
    data.set(this.data);
    const ids = new Int32Array(cap);
    ids.set(this.ids);
    const classes = new Int32Array(cap);
    classes.set(this.classes);
    this.data = data;
    this.ids = ids;
    this.classes = classes;
  }

  upsert(id: number, vector: ArrayLike<number>, classIndex = -1): void {
    if ((id | 0) !== id) throw new RangeError(`item id must be an int32, got ${id}`);
    if (vector.length !== this.dim) throw new RangeError(`vector has ${vector.length} values, index dim is ${this.dim}`);
    let row = this.rowOf.get(id);
    if (row === undefined) {
      if (this.count === this.ids.length) this.grow();
      row = this.count++;
      this.rowOf.set(id, row);
      this.ids[row] = id;
    }
    this.classes[row] = classIndex;
    const off = row * this.dim;
    for (let j = 0; j < this.dim; j += 1) this.data[off + j] = vector[j];
    if (this.metric === "cosine") normaliseInto(this.data, off, this.dim, this.data, off);
  }

  setClass(id: number, classIndex: number): void {
    const row = this.rowOf.get(id);
    if (row === undefined) throw new RangeError(`unknown item id ${id}`);
    this.classes[row] = classIndex;
  }

  remove(id: number): boolean {
    const row = this.rowOf.get(id);
    if (row === undefined) return false;
    const last = this.count - 1;
    if (row !== last) {
      this.data.copyWithin(row * this.dim, last * this.dim, (last + 1) * this.dim);
      this.ids[row] = this.ids[last];
      this.classes[row] = this.classes[last];
      this.rowOf.set(this.ids[row], row);
    }
    this.rowOf.delete(id);
    this.count = last;
    return true;
  }

  /** The k nearest rows to `query`, nearest first; equal distances → lower id first. */
  search(query: ArrayLike<number>, k: number, options: SearchOptions = {}): Neighbour[] {
    const d = this.dim;
    if (query.length !== d) throw new RangeError(`query has ${query.length} values, index dim is ${d}`);
    const q = this.scratch;
    for (let j = 0; j < d; j += 1) q[j] = query[j];
    if (this.metric === "cosine") normaliseInto(q, 0, d, q, 0);
    const top = new TopK(Math.min(k, this.count));
    const exclude = options.excludeId ?? Number.NaN;
    const all = options.includeNonVoters === true;
    const { data, ids, classes, count } = this;
    if (this.metric === "euclidean") {
      for (let r = 0; r < count; r += 1) {
        if ((!all && classes[r] < 0) || ids[r] === exclude) continue;
        const s = partialScore(data, r * d, q, d, false, top.bound);
        if (s <= top.bound) top.push(s, ids[r], r);
      }
    } else if (this.metric === "manhattan") {
      for (let r = 0; r < count; r += 1) {
        if ((!all && classes[r] < 0) || ids[r] === exclude) continue;
        const s = partialScore(data, r * d, q, d, true, top.bound);
        if (s <= top.bound) top.push(s, ids[r], r);
      }
    } else {
      for (let r = 0; r < count; r += 1) {
        if ((!all && classes[r] < 0) || ids[r] === exclude) continue;
        const c = 1 - dot(data, r * d, q, 0, d);
        const s = c < COSINE_ZERO ? 0 : c;
        if (s <= top.bound) top.push(s, ids[r], r);
      }
    }
    return top.sorted().map((e) => ({ id: e.id, classIndex: classes[e.row], distance: toDistance(this.metric, e.distance) }));
  }
}
