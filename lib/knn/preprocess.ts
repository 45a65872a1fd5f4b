import { z } from "zod";
import { scalings, type Scaling } from "./types";

/**
 * A table to encode: `numeric` is packed row-major (n × numericWidth, NaN = missing);
 * `categorical[c][i]` is the value of categorical column c in row i (null = missing).
 */
export interface TableInput {
  n: number;
  numeric: Float32Array;
  numericWidth: number;
  categorical: readonly (readonly (string | null)[])[];
}

export const preprocessStateSchema = z.object({
  version: z.literal(1),
  scaling: z.enum(scalings),
  numeric: z.array(z.object({ centre: z.number(), scale: z.number().positive(), fill: z.number() })),
  categorical: z.array(z.object({ categories: z.array(z.string()) })),
  width: z.number().int().nonnegative(),
});

/** Fitted preprocessing: plain JSON, stored with a project. */
export type PreprocessState = z.infer<typeof preprocessStateSchema>;

/**
 * Fits on the given rows. Numeric column rules (statistics over present values only):
 * - zscore: centre = mean, scale = population standard deviation (divide by n);
 * - minmax: centre = min, scale = max − min;  none: centre 0, scale 1;
 * - a constant column (scale 0) or a column with no present value gets scale 1;
 * - missing value → the column mean of present values (0 if none), then scaled like any value.
 * Categorical columns: one-hot over the categories seen when fitting, sorted by code unit;
 * missing or unseen values encode as all zeros.
 */
export function fitPreprocessor(input: TableInput, scaling: Scaling = "zscore"): PreprocessState {
  const { n, numeric, numericWidth: w } = input;
  checkShape(input);
  const cols = [];
  for (let j = 0; j < w; j += 1) {
    let count = 0;
    let sum = 0;
    let min = Infinity;
    let max = -Infinity;
    for (let i = 0; i < n; i += 1) {
      const v = numeric[i * w + j];
      if (Number.isNaN(v)) continue;
      count += 1;
      sum += v;
      if (v < min) min = v;
      if (v > max) max = v;
    }
    const mean = count > 0 ? sum / count : 0;
    let sq = 0;
    for (let i = 0; i < n; i += 1) {
      const v = numeric[i * w + j];
      if (!Number.isNaN(v)) sq += (v - mean) * (v - mean);
    }
    const sd = count > 0 ? Math.sqrt(sq / count) : 0;
    let centre = 0;
    let scale = 1;
    if (scaling === "zscore") {
      centre = mean;
      scale = sd;
    } else if (scaling === "minmax" && count > 0) {
      centre = min;
      scale = max - min;
    }
    if (!(scale > 0) || !Number.isFinite(scale)) scale = 1;
    cols.push({ centre, scale, fill: mean });
  }
  const categorical = input.categorical.map((column) => {
    const seen = new Set<string>();
    for (const v of column) if (v !== null) seen.add(v);
    return { categories: [...seen].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)) };
  });
  const width = w + categorical.reduce((s, c) => s + c.categories.length, 0);
  return { version: 1, scaling, numeric: cols, categorical, width };
}

/** Encodes rows with a fitted state into packed n × state.width Float32 rows. */
export function transformTable(state: PreprocessState, input: TableInput): Float32Array {
  checkShape(input);
  const { n, numeric, numericWidth: w } = input;
  if (w !== state.numeric.length) throw new RangeError(`expected ${state.numeric.length} numeric columns, got ${w}`);
  if (input.categorical.length !== state.categorical.length) {
    throw new RangeError(`expected ${state.categorical.length} categorical columns, got ${input.categorical.length}`);
  }
  const out = new Float32Array(n * state.width);
  const lookups = state.categorical.map((c) => new Map(c.categories.map((v, i) => [v, i])));
  for (let i = 0; i < n; i += 1) {
    const o = i * state.width;
    for (let j = 0; j < w; j += 1) {
      const col = state.numeric[j];
      const raw = numeric[i * w + j];
      out[o + j] = ((Number.isNaN(raw) ? col.fill : raw) - col.centre) / col.scale;
    }
    let off = o + w;
    for (let c = 0; c < lookups.length; c += 1) {
      const v = input.categorical[c][i];
      const at = v === null ? undefined : lookups[c].get(v);
      if (at !== undefined) out[off + at] = 1;
      off += state.categorical[c].categories.length;
    }
  }
  return out;
}

function checkShape(input: TableInput): void {
  if (input.numeric.length !== input.n * input.numericWidth) {
    throw new RangeError(`numeric has ${input.numeric.length} values for ${input.n} × ${input.numericWidth}`);
  }
  for (const column of input.categorical) {
    if (column.length !== input.n) throw new RangeError(`a categorical column has ${column.length} values for ${input.n} rows`);
  }
}
