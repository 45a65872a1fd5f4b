import { PCA } from "ml-pca";
import { ExactIndex } from "./exact-index";
import { randomOrder } from "./scores";
import type { LabelledSet } from "./tuning";
import type { Weighting } from "./types";
import { vote } from "./vote";

export interface MapOptions {
  k: number;
  weighting?: Weighting;
  /** Cells per side of the square grid (default 48). */
  gridSize?: number;
  /** Rows used to fit the PCA (default 20 000). */
  fitSample?: number;
  /** Points returned for drawing (default 5 000). */
  maxPoints?: number;
  /** Labelled points that vote on the grid (default 20 000). */
  maxVoters?: number;
  seed?: number;
}

export interface MapCell {
  x: number;
  y: number;
  classIndex: number;
  topShare: number;
}

export interface ItemMap {
  method: string;
  sampling: string;
  explainedVariance: [number, number];
  points: { id: number; x: number; y: number; classIndex: number }[];
  grid: { size: number; xMin: number; xMax: number; yMin: number; yMax: number; cells: MapCell[] };
}

/** Ascending positions of a seeded sample of `m` of `n` rows (all rows when n ≤ m). */
function sampleRows(n: number, m: number, seed: number): Int32Array {
  if (n <= m) return Int32Array.from({ length: n }, (_, i) => i);
  return randomOrder(n, seed).slice(0, m).sort();
}

/**
 * The Map: a 2-D PCA projection of the items and suggestion regions drawn by a k-NN vote computed
 * in the projected plane over the projected labelled items. The regions are therefore a faithful
 * view of the 2-D projection, not of the full-dimensional vote (stated in `method`).
 */
export function computeMap(set: LabelledSet, options: MapOptions): ItemMap {
  const { dim, vectors, classes } = set;
  const n = classes.length;
  const ids = set.ids ?? Int32Array.from({ length: n }, (_, i) => i);
  const seed = options.seed ?? 1;
  const fitRows = sampleRows(n, options.fitSample ?? 20_000, seed);
  const fitData = Array.from(fitRows, (r) => Array.from(vectors.subarray(r * dim, (r + 1) * dim)));
  const pca = new PCA(fitData, { method: "covarianceMatrix", center: true });
  const u = pca.getEigenvectors();
  const means = pca.toJSON().means;
  const axes = [0, 1].map((c) => Float64Array.from({ length: dim }, (_, j) => (c < u.columns ? u.get(j, c) : 0)));
  const ev = pca.getExplainedVariance();
  const xy = new Float32Array(n * 2);
  for (let i = 0; i < n; i += 1) {
    let a = 0;
    let b = 0;
    for (let j = 0; j < dim; j += 1) {
      const v = vectors[i * dim + j] - means[j];
      a += v * axes[0][j];
      b += v * axes[1][j];
    }
    xy[2 * i] = a;
    xy[2 * i + 1] = b;
  }
  let xMin = Infinity;
  let xMax = -Infinity;
  let yMin = Infinity;
  let yMax = -Infinity;
  for (let i = 0; i < n; i += 1) {
    xMin = Math.min(xMin, xy[2 * i]);
    xMax = Math.max(xMax, xy[2 * i]);
    yMin = Math.min(yMin, xy[2 * i + 1]);
    yMax = Math.max(yMax, xy[2 * i + 1]);
  }
  if (n === 0) [xMin, xMax, yMin, yMax] = [-1, 1, -1, 1];
  const voterRows: number[] = [];
  for (let i = 0; i < n; i += 1) if (classes[i] >= 0) voterRows.push(i);
  const maxVoters = options.maxVoters ?? 20_000;
  const chosen = sampleRows(voterRows.length, maxVoters, seed + 1);
  const plane = new ExactIndex(2, "euclidean", Math.max(1, chosen.length));
  for (const c of chosen) {
    const r = voterRows[c];
    plane.upsert(ids[r], xy.subarray(2 * r, 2 * r + 2), classes[r]);
  }
  const size = options.gridSize ?? 48;
  const cells: MapCell[] = [];
  const dx = (xMax - xMin) / size || 1;
  const dy = (yMax - yMin) / size || 1;
  for (let gy = 0; gy < size; gy += 1) {
    for (let gx = 0; gx < size; gx += 1) {
      const x = xMin + (gx + 0.5) * dx;
      const y = yMin + (gy + 0.5) * dy;
      const v = vote(plane.search([x, y], options.k), set.numClasses, options.weighting ?? "uniform");
      cells.push({ x, y, classIndex: v.top, topShare: v.top >= 0 ? v.shares[v.top] : 0 });
    }
  }
  const maxPoints = options.maxPoints ?? 5_000;
  const shown = sampleRows(n, maxPoints, seed + 2);
  const points = Array.from(shown, (r) => ({ id: ids[r], x: xy[2 * r], y: xy[2 * r + 1], classIndex: classes[r] }));
  return {
    method:
      `PCA (covariance, centred) to 2-D; each grid cell's class and top share are a ${options.k}-NN ` +
      `${options.weighting ?? "uniform"} vote computed in the projected plane over the projected labelled items ` +
      "(a faithful view of the 2-D projection, not of the full-space vote)",
    sampling:
      `PCA fitted on ${fitRows.length} of ${n} rows; ${chosen.length} of ${voterRows.length} labelled rows vote on the grid; ` +
      `${points.length} of ${n} points returned; samples are uniform without replacement, seed ${seed}`,
    explainedVariance: [ev[0] ?? 0, ev[1] ?? 0],
    points,
    grid: { size, xMin, xMax, yMin, yMax, cells },
  };
}
