import * as kernel from "./batch-kernel";
import * as clusterIndex from "./cluster-index";
import type { ClusterParts } from "./cluster-index";
import * as distance from "./distance";
import { TopK } from "./top-k";
import type { Neighbour } from "./types";

/** One query's result as the batch hands it over: parallel arrays, nearest first, valid until the next call. */
export type BatchResult = (query: number, count: number, ids: Int32Array, classes: Int32Array, distances: Float64Array) => void;

// Module-local copies: the CommonJS output reads imported bindings through getters, too slow per row.
const { BLOCK, dotBlock, dotFormTolerance, squaredNorm, transposeBlock } = kernel;
const { CLUSTER_SLACK, reported } = clusterIndex;
const { normaliseInto, partialScore } = distance;

/** Queries whose centroid distances are held at once (bounded memory: CHUNK_CELLS / lists queries). */
const CHUNK_CELLS = 1 << 22;

/**
 * Exact k-NN for many queries at once over a ClusterIndex's parts (euclidean or cosine; cosine
 * rows are unit length and ranked by ‖a − b‖², as ClusterIndex does). Queries are grouped by
 * their nearest list and searched BLOCK at a time: distances to a shared list come from one
 * register-blocked dot-product pass (‖q‖² + ‖x‖² − 2 q·x with precomputed norms) that only filters;
 * every row passing the filter (the form minus its rounding allowance ≤ the query's k-th distance)
 * is re-scored by the exact scan's own sum, so results equal ExactIndex / ClusterIndex bit for bit.
 * Lists are skipped by the same triangle-inequality rule as ClusterIndex.search.
 */
export class ClusterBatchSearcher {
  readonly parts: ClusterParts;
  /** ‖x‖² per stored row, and per centroid. */
  private readonly norms: Float64Array;
  private readonly centroidNorms: Float64Array;
  /** Row c·lists + t = the t-th nearest list to list c (by centroid distance), t = 0 is c itself. */
  private readonly listOrder: Int32Array;
  private readonly tol: number;
  private readonly qt = new Float64Array(0);
  private dots = new Float64Array(0);
  private readonly seen: Uint8Array;
  private readonly tops: TopK[] = [];
  /** The block's query rows, and a fixed view of each (no allocation per block). */
  private readonly qrows: Float32Array;
  private readonly qviews: Float32Array[] = [];
  private readonly block = new Int32Array(BLOCK);
  private readonly limits = new Float64Array(BLOCK);
  private outDist: Float64Array;
  private outIds: Int32Array;
  private outRows: Int32Array;
  private outClasses: Int32Array;
  private outReported: Float64Array;

  private readonly chunk: number;

  /** `chunkQueries`: queries whose centroid distances are held at once (default from a 32 MB budget). */
  constructor(parts: ClusterParts, options: { chunkQueries?: number } = {}) {
    if (parts.metric === "manhattan") throw new RangeError("the batched search needs an inner-product form: euclidean or cosine");
    this.parts = parts;
    const { dim, lists, data, centroids } = parts;
    const n = parts.ids.length;
    this.norms = new Float64Array(n);
    for (let r = 0; r < n; r += 1) this.norms[r] = squaredNorm(data, r, dim);
    this.centroidNorms = new Float64Array(lists);
    for (let c = 0; c < lists; c += 1) this.centroidNorms[c] = squaredNorm(centroids, c, dim);
    this.listOrder = new Int32Array(lists * lists);
    const d2 = new Float64Array(lists);
    const idx = Array.from({ length: lists }, (_, i) => i);
    for (let c = 0; c < lists; c += 1) {
      for (let e = 0; e < lists; e += 1) {
        let s = 0;
        for (let j = 0; j < dim; j += 1) {
          const t = centroids[c * dim + j] - centroids[e * dim + j];
          s += t * t;
        }
        d2[e] = e === c ? -1 : s;
      }
      idx.sort((a, b) => d2[a] - d2[b] || a - b);
      this.listOrder.set(idx, c * lists);
    }
    this.tol = dotFormTolerance(dim);
    this.chunk = Math.max(1, Math.floor(options.chunkQueries ?? Math.max(BLOCK, CHUNK_CELLS / lists)));
    this.qt = new Float64Array(dim * BLOCK);
    this.qrows = new Float32Array(dim * BLOCK);
    for (let b = 0; b < BLOCK; b += 1) this.qviews.push(this.qrows.subarray(b * dim, (b + 1) * dim));
    this.seen = new Uint8Array(lists);
    this.outDist = new Float64Array(0);
    this.outIds = new Int32Array(0);
    this.outRows = new Int32Array(0);
    this.outClasses = new Int32Array(0);
    this.outReported = new Float64Array(0);
  }

  /** Calls `onResult` once per query row of `queries` (packed, raw: cosine rows are normalised here). */
  searchAll(queries: Float32Array, k: number, onResult: BatchResult, start = 0, end = queries.length / this.parts.dim): void {
    const { dim, lists, metric } = this.parts;
    const kk = Math.min(k, this.parts.ids.length);
    this.prepare(kk);
    const chunk = this.chunk;
    const qbuf = new Float32Array(Math.min(chunk, Math.max(0, end - start)) * dim);
    const qn = new Float64Array(qbuf.length / dim);
    const dcLow = new Float64Array(qn.length * lists);
    const first = new Int32Array(qn.length);
    const perm = new Int32Array(qn.length + BLOCK);
    const counts = new Int32Array(lists + 1);
    for (let c0 = start; c0 < end; c0 += chunk) {
      const nq = Math.min(chunk, end - c0);
      qbuf.set(queries.subarray(c0 * dim, (c0 + nq) * dim));
      if (metric === "cosine") for (let i = 0; i < nq; i += 1) normaliseInto(qbuf, i * dim, dim, qbuf, i * dim);
      for (let i = 0; i < nq; i += 1) qn[i] = squaredNorm(qbuf, i, dim);
      this.centroidDistances(qbuf, qn, nq, dcLow, first);
      // Counting sort by nearest list: consecutive queries share their first list.
      counts.fill(0);
      for (let i = 0; i < nq; i += 1) counts[first[i] + 1] += 1;
      for (let c = 0; c < lists; c += 1) counts[c + 1] += counts[c];
      for (let i = 0; i < nq; i += 1) perm[counts[first[i]]++] = i;
      for (let p = nq; p < nq + BLOCK; p += 1) perm[p] = perm[nq - 1];
      for (let p = 0; p < nq; p += BLOCK) {
        const block = this.block;
        for (let b = 0; b < BLOCK; b += 1) block[b] = perm[p + b];
        this.searchBlock(qbuf, qn, dcLow, first, block);
        for (let b = 0; b < BLOCK && p + b < nq; b += 1) this.emit(b, c0 + block[b], onResult);
      }
    }
  }

  /** Convenience form: the k nearest of each query as Neighbour lists (tests, recall checks). */
  searchMany(queries: Float32Array, k: number): Neighbour[][] {
    const out: Neighbour[][] = [];
    this.searchAll(queries, k, (q, count, ids, classes, distances) => {
      const list: Neighbour[] = [];
      for (let i = 0; i < count; i += 1) list.push({ id: ids[i], classIndex: classes[i], distance: distances[i] });
      out[q] = list;
    });
    return out;
  }

  private prepare(k: number): void {
    this.tops.length = 0;
    for (let b = 0; b < BLOCK; b += 1) this.tops.push(new TopK(k));
    this.outDist = new Float64Array(k);
    this.outIds = new Int32Array(k);
    this.outRows = new Int32Array(k);
    this.outClasses = new Int32Array(k);
    this.outReported = new Float64Array(k);
    let longest = this.parts.lists;
    const { offsets } = this.parts;
    for (let c = 0; c < this.parts.lists; c += 1) longest = Math.max(longest, offsets[c + 1] - offsets[c]);
    if (this.dots.length < longest * BLOCK) this.dots = new Float64Array(longest * BLOCK);
  }

  /** Lower bounds on the Euclidean query–centroid distances (the form minus its allowance), and each query's nearest list. */
  private centroidDistances(qbuf: Float32Array, qn: Float64Array, nq: number, dcLow: Float64Array, first: Int32Array): void {
    const { dim, lists, centroids } = this.parts;
    const rows = new Int32Array(BLOCK);
    const dots = this.dots;
    for (let i = 0; i < nq; i += BLOCK) {
      for (let b = 0; b < BLOCK; b += 1) rows[b] = Math.min(i + b, nq - 1);
      transposeBlock(qbuf, rows, dim, this.qt);
      dotBlock(centroids, 0, lists, dim, this.qt, dots);
      for (let b = 0; b < BLOCK && i + b < nq; b += 1) {
        const q = i + b;
        let best = 0;
        let bestD = Infinity;
        for (let c = 0; c < lists; c += 1) {
          const cn = this.centroidNorms[c];
          const form = qn[q] + cn - 2 * dots[c * BLOCK + b];
          const low = Math.sqrt(Math.max(0, form - this.tol * (qn[q] + cn)));
          dcLow[q * lists + c] = low;
          if (form < bestD) {
            bestD = form;
            best = c;
          }
        }
        first[q] = best;
      }
    }
  }

  private searchBlock(qbuf: Float32Array, qn: Float64Array, dcLow: Float64Array, first: Int32Array, block: Int32Array): void {
    const { dim, lists, radius } = this.parts;
    transposeBlock(qbuf, block, dim, this.qt);
    for (let b = 0; b < BLOCK; b += 1) this.qrows.set(qbuf.subarray(block[b] * dim, (block[b] + 1) * dim), b * dim);
    for (let b = 0; b < BLOCK; b += 1) this.tops[b].reset();
    const seen = this.seen;
    seen.fill(0);
    // Each query's own nearest list first (sets a tight k-th distance), then the lists nearest to the block's first list.
    for (let b = 0; b < BLOCK; b += 1) {
      const c = first[block[b]];
      if (seen[c] === 0) {
        seen[c] = 1;
        this.scanList(c, qn, block);
      }
    }
    this.updateLimits();
    const limits = this.limits;
    const order = first[block[0]] * lists;
    for (let t = 1; t < lists; t += 1) {
      const c = this.listOrder[order + t];
      if (seen[c] === 1) continue;
      let needed = false;
      for (let b = 0; b < BLOCK && !needed; b += 1) needed = dcLow[block[b] * lists + c] - radius[c] <= limits[b];
      if (needed) {
        this.scanList(c, qn, block);
        this.updateLimits();
      }
    }
  }

  /** Per query: a list is skipped when d(q, centroid) − radius exceeds this (the k-th distance plus slack; Infinity while fewer than k found). */
  private updateLimits(): void {
    for (let b = 0; b < BLOCK; b += 1) {
      const top = this.tops[b];
      if (top.k === 0) this.limits[b] = -Infinity;
      else {
        const kth = top.size < top.k ? Infinity : Math.sqrt(top.bound);
        this.limits[b] = kth * (1 + CLUSTER_SLACK) + CLUSTER_SLACK;
      }
    }
  }

  private scanList(c: number, qn: Float64Array, block: Int32Array): void {
    const { dim, offsets, data, ids, classes } = this.parts;
    const r0 = offsets[c];
    const r1 = offsets[c + 1];
    if (r1 <= r0) return;
    const dots = this.dots;
    dotBlock(data, r0, r1, dim, this.qt, dots);
    const tol = this.tol;
    const norms = this.norms;
    for (let b = 0; b < BLOCK; b += 1) {
      const top = this.tops[b];
      if (top.k === 0) continue;
      const q = block[b];
      const n2 = qn[q];
      const view = this.qviews[b];
      let bound = top.bound;
      let limit = bound + tol * (n2 + bound);
      for (let r = r0, w = b; r < r1; r += 1, w += BLOCK) {
        const xn = norms[r];
        if (n2 + xn - 2 * dots[w] - tol * xn > limit || classes[r] < 0) continue;
        const s = partialScore(data, r * dim, view, dim, false, bound);
        if (s <= bound) {
          top.push(s, ids[r], r);
          bound = top.bound;
          limit = bound + tol * (n2 + bound);
        }
      }
    }
  }

  private emit(b: number, query: number, onResult: BatchResult): void {
    const count = this.tops[b].sortedInto(this.outDist, this.outIds, this.outRows);
    const { metric, classes } = this.parts;
    for (let i = 0; i < count; i += 1) {
      this.outClasses[i] = classes[this.outRows[i]];
      this.outReported[i] = reported(metric, this.outDist[i]);
    }
    onResult(query, count, this.outIds, this.outClasses, this.outReported);
  }
}
