import { ExactIndex } from "./exact-index";
import type { Distance, Neighbour, Weighting } from "./types";
import { vote } from "./vote";

/** Log-loss smoothing: p = (share + ε) / (1 + C·ε), so a zero share costs ln((1 + Cε)/ε), not ∞. */
export const LOG_LOSS_EPSILON = 1e-3;
export const logLossSmoothing = `p = (share + ${LOG_LOSS_EPSILON}) / (1 + ${LOG_LOSS_EPSILON}·C), C = classes in the label set, natural log`;

export interface LabelledSet {
  /** Packed n × dim rows (already preprocessed). */
  vectors: Float32Array;
  dim: number;
  /** Class index per row; −1 rows neither vote nor are evaluated. */
  classes: Int32Array;
  /** Item id per row (defaults to the row number). */
  ids?: Int32Array;
  numClasses: number;
}

export interface ReliabilityBin {
  lower: number;
  upper: number;
  count: number;
  meanTopShare: number | null;
  accuracy: number | null;
}

export interface TuningResult {
  k: number;
  distance: Distance;
  accuracy: number;
  correct: number;
  n: number;
  logLoss: number;
  macroF1: number;
  reliability: { bins: ReliabilityBin[]; ece: number };
}

export const defaultKs = Array.from({ length: 26 }, (_, i) => 2 * i + 1);

/** For each voting row, its maxK nearest voters excluding itself (one search per row). */
export function leaveOneOutNeighbours(set: LabelledSet, metric: Distance, maxK: number): { rows: number[]; neighbours: Neighbour[][] } {
  const n = set.classes.length;
  const ids = set.ids ?? Int32Array.from({ length: n }, (_, i) => i);
  const index = ExactIndex.from(set.vectors, set.dim, set.classes, metric, ids);
  const rows: number[] = [];
  const neighbours: Neighbour[][] = [];
  for (let i = 0; i < n; i += 1) {
    if (set.classes[i] < 0) continue;
    rows.push(i);
    neighbours.push(index.search(set.vectors.subarray(i * set.dim, (i + 1) * set.dim), maxK, { excludeId: ids[i] }));
  }
  return { rows, neighbours };
}

/**
 * Leave-one-out over the labelled set for every k in `ks` and every distance: one search of
 * max(ks) per item per distance, then every k is read off the same neighbour list.
 */
export function tune(set: LabelledSet, options: { ks?: number[]; distances?: Distance[]; weighting?: Weighting; bins?: number } = {}): TuningResult[] {
  const ks = options.ks ?? defaultKs;
  const maxK = Math.max(...ks);
  const results: TuningResult[] = [];
  for (const metric of options.distances ?? ["euclidean"]) {
    const { rows, neighbours } = leaveOneOutNeighbours(set, metric, maxK);
    const truth = rows.map((r) => set.classes[r]);
    for (const k of ks) {
      const votes = neighbours.map((list) => vote(list.slice(0, k), set.numClasses, options.weighting ?? "uniform"));
      results.push({ k, distance: metric, ...evaluate(truth, votes, set.numClasses, options.bins ?? 10) });
    }
  }
  return results;
}

/** Accuracy, macro-F1, smoothed log-loss and the reliability table of votes against true classes. */
export function evaluate(truth: readonly number[], votes: readonly { top: number; shares: ArrayLike<number> }[], numClasses: number, bins = 10) {
  const n = truth.length;
  const tp = new Float64Array(numClasses);
  const fp = new Float64Array(numClasses);
  const fn = new Float64Array(numClasses);
  let correct = 0;
  let loss = 0;
  for (let i = 0; i < n; i += 1) {
    const t = truth[i];
    const p = votes[i].top;
    if (p === t) {
      correct += 1;
      tp[t] += 1;
    } else {
      fn[t] += 1;
      if (p >= 0) fp[p] += 1;
    }
    loss -= Math.log((votes[i].shares[t] + LOG_LOSS_EPSILON) / (1 + numClasses * LOG_LOSS_EPSILON));
  }
  // Macro-F1: mean of F1 = 2TP / (2TP + FP + FN) over classes that occur as truth or prediction.
  let f1Sum = 0;
  let f1Count = 0;
  for (let c = 0; c < numClasses; c += 1) {
    const denom = 2 * tp[c] + fp[c] + fn[c];
    if (denom === 0) continue;
    f1Sum += (2 * tp[c]) / denom;
    f1Count += 1;
  }
  const topShares = votes.map((v) => (v.top >= 0 ? v.shares[v.top] : 0));
  return {
    accuracy: n > 0 ? correct / n : 0,
    correct,
    n,
    logLoss: n > 0 ? loss / n : 0,
    macroF1: f1Count > 0 ? f1Sum / f1Count : 0,
    reliability: reliability(topShares, truth.map((t, i) => votes[i].top === t), bins),
  };
}

/**
 * Reliability table: equal-width bins of the top share over [0, 1] (the last bin includes 1);
 * ECE = Σ (count_b / n) · |accuracy_b − meanTopShare_b|.
 */
export function reliability(topShares: readonly number[], correct: readonly boolean[], bins = 10): { bins: ReliabilityBin[]; ece: number } {
  const count = new Float64Array(bins);
  const shareSum = new Float64Array(bins);
  const right = new Float64Array(bins);
  for (let i = 0; i < topShares.length; i += 1) {
    const b = Math.min(bins - 1, Math.floor(topShares[i] * bins));
    count[b] += 1;
    shareSum[b] += topShares[i];
    if (correct[i]) right[b] += 1;
  }
  let ece = 0;
  const out: ReliabilityBin[] = [];
  for (let b = 0; b < bins; b += 1) {
    const c = count[b];
    const meanTopShare = c > 0 ? shareSum[b] / c : null;
    const accuracy = c > 0 ? right[b] / c : null;
    if (c > 0) ece += (c / topShares.length) * Math.abs(accuracy! - meanTopShare!);
    out.push({ lower: b / bins, upper: (b + 1) / bins, count: c, meanTopShare, accuracy });
  }
  return { bins: out, ece };
}
