/** A growable row-by-row sparse matrix (CSR): row p lists (target, coefficient) entries. */
export class SparseRowsBuilder {
  private target = new Int32Array(1024);
  private coef = new Float64Array(1024);
  private length = 0;
  private readonly rowStart: number[] = [0];

  add(target: number, coefficient: number): void {
    if (coefficient === 0) return;
    if (this.length === this.target.length) {
      const target = new Int32Array(this.length * 2);
      target.set(this.target);
      this.target = target;
      const coef = new Float64Array(this.length * 2);
      coef.set(this.coef);
      this.coef = coef;
    }
    this.target[this.length] = target;
    this.coef[this.length] = coefficient;
    this.length += 1;
  }

  endRow(): void {
    this.rowStart.push(this.length);
  }

  build(): SparseRows {
    return {
      start: Int32Array.from(this.rowStart),
      target: this.target.slice(0, this.length),
      coef: this.coef.slice(0, this.length),
    };
  }
}

export interface SparseRows {
  start: Int32Array;
  target: Int32Array;
  coef: Float64Array;
}

/** acc = Σ_p weights[p] · row_p: the weighted sum that every resample reduces to. */
export function accumulate(rows: SparseRows, weights: Float64Array, acc: Float64Array): void {
  acc.fill(0);
  const { start, target, coef } = rows;
  const n = start.length - 1;
  for (let p = 0; p < n; p += 1) {
    const w = weights[p];
    if (w === 0) continue;
    for (let j = start[p], end = start[p + 1]; j < end; j += 1) acc[target[j]] += w * coef[j];
  }
}
