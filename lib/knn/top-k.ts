/**
 * Bounded top-k of (distance, id) pairs kept as a max-heap: the root is the worst kept pair.
 * Order: smaller distance first; equal distances → lower item id first (the k-th place tie rule).
 */
export class TopK {
  readonly k: number;
  size = 0;
  private readonly dist: Float64Array;
  private readonly ids: Int32Array;
  private readonly rows: Int32Array;

  constructor(k: number) {
    this.k = Math.max(0, Math.floor(k));
    this.dist = new Float64Array(this.k);
    this.ids = new Int32Array(this.k);
    this.rows = new Int32Array(this.k);
  }

  /** Distance a candidate must beat (or tie with a lower id) to enter; Infinity while not full. */
  get bound(): number {
    return this.size < this.k ? Infinity : this.dist[0];
  }

  private worse(a: number, b: number): boolean {
    const da = this.dist[a];
    const db = this.dist[b];
    return da > db || (da === db && this.ids[a] > this.ids[b]);
  }

  push(distance: number, id: number, row = -1): void {
    if (this.k === 0) return;
    if (this.size < this.k) {
      let i = this.size++;
      this.dist[i] = distance;
      this.ids[i] = id;
      this.rows[i] = row;
      while (i > 0) {
        const p = (i - 1) >> 1;
        if (!this.worse(i, p)) break;
        this.swap(i, p);
        i = p;
      }
      return;
    }
    const rootD = this.dist[0];
    if (distance > rootD || (distance === rootD && id > this.ids[0])) return;
    this.dist[0] = distance;
    this.ids[0] = id;
    this.rows[0] = row;
    let i = 0;
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let m = i;
      if (l < this.size && this.worse(l, m)) m = l;
      if (r < this.size && this.worse(r, m)) m = r;
      if (m === i) break;
      this.swap(i, m);
      i = m;
    }
  }

  private swap(a: number, b: number): void {
    const d = this.dist[a];
    this.dist[a] = this.dist[b];
    this.dist[b] = d;
    const id = this.ids[a];
    this.ids[a] = this.ids[b];
    this.ids[b] = id;
    const r = this.rows[a];
    this.rows[a] = this.rows[b];
    this.rows[b] = r;
  }

  /** Empties the heap for reuse (no allocation). */
  reset(): void {
    this.size = 0;
  }

  /**
   * Writes the kept pairs nearest first (ties by lower id) into the given arrays, without
   * allocating; returns how many. Insertion sort: k is small.
   */
  sortedInto(dist: Float64Array, ids: Int32Array, rows: Int32Array): number {
    const n = this.size;
    for (let i = 0; i < n; i += 1) {
      const d = this.dist[i];
      const id = this.ids[i];
      const row = this.rows[i];
      let j = i - 1;
      while (j >= 0 && (dist[j] > d || (dist[j] === d && ids[j] > id))) {
        dist[j + 1] = dist[j];
        ids[j + 1] = ids[j];
        rows[j + 1] = rows[j];
        j -= 1;
      }
      dist[j + 1] = d;
      ids[j + 1] = id;
      rows[j + 1] = row;
    }
    return n;
  }

  /** Kept pairs, nearest first (ties by lower id). */
  sorted(): { distance: number; id: number; row: number }[] {
    const out = [];
    for (let i = 0; i < this.size; i += 1) out.push({ distance: this.dist[i], id: this.ids[i], row: this.rows[i] });
    return out.sort((a, b) => a.distance - b.distance || a.id - b.id);
  }
}
