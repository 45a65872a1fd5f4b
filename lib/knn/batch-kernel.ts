/** Queries searched together by the register-blocked kernel. */
export const BLOCK = 4;

/**
 * Rounding allowance of the dot-product form ‖q‖² + ‖x‖² − 2 q·x, as a multiple of
 * (‖q‖² + ‖x‖² + bound). Products of float32 values are exact in float64; a float64 sum of d
 * terms errs by at most (d − 1)·2⁻⁵³·Σ|terms| (Higham, "Accuracy and Stability of Numerical
 * Algorithms", 2nd ed., §4.2), and |2 q·x| ≤ ‖q‖² + ‖x‖². So the form and the exact scan's
 * Σ(xⱼ − qⱼ)² differ by less than (3d + 8)·2⁻⁵³·(‖q‖² + ‖x‖² + bound); twice that is used.
 */
export function dotFormTolerance(dim: number): number {
  return (3 * dim + 8) * Number.EPSILON;
}

/** Σ v² of row `r` (float64 from float32). */
export function squaredNorm(data: Float32Array, r: number, dim: number): number {
  let s = 0;
  const o = r * dim;
  for (let j = 0; j < dim; j += 1) s += data[o + j] * data[o + j];
  return s;
}

/**
 * Copies BLOCK query rows (row indices in `rows`, taken from `queries`) into `qt`, transposed:
 * qt[j·BLOCK + b] = query b's value j, so the kernel reads one contiguous group per dimension.
 */
export function transposeBlock(queries: Float32Array, rows: ArrayLike<number>, dim: number, qt: Float64Array): void {
  for (let b = 0; b < BLOCK; b += 1) {
    const o = rows[b] * dim;
    for (let j = 0; j < dim; j += 1) qt[j * BLOCK + b] = queries[o + j];
  }
}

/**
 * Dot products of the BLOCK transposed queries in `qt` with rows [r0, r1) of `data`:
 * out[(r − r0)·BLOCK + b] = q_b · x_r. Register-blocked 4 queries × 2 rows: each loaded value
 * is used four or two times, which plain JS cannot get from a one-query loop.
 */
export function dotBlock(data: Float32Array, r0: number, r1: number, dim: number, qt: Float64Array, out: Float64Array): void {
  let r = r0;
  let w = 0;
  for (; r + 1 < r1; r += 2) {
    const xo = r * dim;
    const yo = xo + dim;
    let a0 = 0;
    let a1 = 0;
    let a2 = 0;
    let a3 = 0;
    let b0 = 0;
    let b1 = 0;
    let b2 = 0;
    let b3 = 0;
    for (let j = 0, p = 0; j < dim; j += 1, p += 4) {
      const u = data[xo + j];
      const v = data[yo + j];
      const q0 = qt[p];
      const q1 = qt[p + 1];
      const q2 = qt[p + 2];
      const q3 = qt[p + 3];
      a0 += u * q0;
      a1 += u * q1;
      a2 += u * q2;
      a3 += u * q3;
      b0 += v * q0;
      b1 += v * q1;
      b2 += v * q2;
      b3 += v * q3;
    }
    out[w] = a0;
    out[w + 1] = a1;
    out[w + 2] = a2;
    out[w + 3] = a3;
    out[w + 4] = b0;
    out[w + 5] = b1;
    out[w + 6] = b2;
    out[w + 7] = b3;
    w += 8;
  }
  if (r < r1) {
    const xo = r * dim;
    let a0 = 0;
    let a1 = 0;
    let a2 = 0;
    let a3 = 0;
    for (let j = 0, p = 0; j < dim; j += 1, p += 4) {
      const u = data[xo + j];
      a0 += u * qt[p];
      a1 += u * qt[p + 1];
      a2 += u * qt[p + 2];
      a3 += u * qt[p + 3];
    }
    out[w] = a0;
    out[w + 1] = a1;
    out[w + 2] = a2;
    out[w + 3] = a3;
  }
}
