import type { PatternTable } from "./patterns";
import { accumulate, type SparseRows, SparseRowsBuilder } from "./sparse";

export const SLOT_PERCENT = 0;
export const SLOT_ALPHA = 1;
export const SLOT_FLEISS = 2;

const PAIRABLE = 0;
const VALUES = 1;
const PERCENT = 2;
const SAME = 3;
const FLEISS_ITEMS = 4;
const FLEISS_SUM = 5;
const MAIN_FIXED = 6;

/** Cohen's (1960) kappa from the two raters' class marginals (each summing to n) and the agreeing count. */
function kappaFromMarginals(agree: number, acc: Float64Array, rowAt: number, colAt: number, k: number): number {
  let n = 0;
  let expected = 0;
  for (let c = 0; c < k; c += 1) {
    n += acc[rowAt + c];
    expected += acc[rowAt + c] * acc[colAt + c];
  }
  if (n <= 0) return NaN;
  expected /= n * n;
  if (1 - expected <= 1e-12) return NaN;
  return (agree / n - expected) / (1 - expected);
}

/** Where each block of per-pair, per-class and per-annotator sums starts in the detail accumulator. */
interface DetailOffsets {
  classDisagree: number;
  pairRow: number;
  pairCol: number;
  pairAgree: number;
  sharedOwn: number;
  sharedAgree: number;
  sharedOther: number;
  finalOwn: number;
  finalFin: number;
  finalAgree: number;
  size: number;
}

function detailOffsets(k: number, a: number, pairs: number): DetailOffsets {
  const sizes = {
    classDisagree: k, pairRow: pairs * k, pairCol: pairs * k, pairAgree: pairs, sharedOwn: a * k,
    sharedAgree: a, sharedOther: a * k, finalOwn: a * k, finalFin: a * k, finalAgree: a,
  };
  let at = 0;
  const offsets = {} as Record<keyof typeof sizes, number>;
  for (const key of Object.keys(sizes) as (keyof typeof sizes)[]) {
    offsets[key] = at;
    at += sizes[key];
  }
  return { ...offsets, size: at };
}

/** Most common ratings-per-item count ≥ 2 (by items); a tie goes to the larger count. 0 when none. */
function chooseFleissM(patterns: PatternTable): number {
  const itemsByM = new Map<number, number>();
  for (let q = 0; q < patterns.size; q += 1) {
    const m = patterns.start[q + 1] - patterns.start[q];
    if (m >= 2) itemsByM.set(m, (itemsByM.get(m) ?? 0) + patterns.count[q]);
  }
  let best = 0;
  let bestItems = 0;
  for (const [m, items] of itemsByM) {
    if (items > bestItems || (items === bestItems && m > best)) [best, bestItems] = [m, items];
  }
  return best;
}

/**
 * Every coefficient is a function of sums over items of per-item quantities, and items with the same rating
 * pattern contribute the same quantities. The constructor writes each pattern's contributions once as a
 * sparse row; evaluate() turns a weight per pattern (point counts, or bootstrap draw counts) into the sums
 * with one sparse pass, then into the coefficients.
 */
export class AgreementEngine {
  readonly classCount: number;
  readonly annotatorCount: number;
  readonly pairCount: number;
  readonly pairA: Int32Array;
  readonly pairB: Int32Array;
  readonly fleissM: number;
  readonly valueCount: number;
  readonly slotPair: number;
  readonly slotClass: number;
  readonly slotVsOthers: number;
  readonly slotVsFinal: number;

  /** Counts of the last evaluate() call (read by the report after the point evaluation). */
  pairableWeight = 0;
  valuesWeight = 0;
  fleissWeight = 0;
  readonly classValues: Float64Array;
  readonly pairN: Float64Array;
  readonly sharedN: Float64Array;
  readonly finalN: Float64Array;
  readonly finalAgree: Float64Array;

  private readonly mainRows: SparseRows;
  private readonly detailRows: SparseRows;
  private readonly main: Float64Array;
  private readonly detail: Float64Array;
  private readonly off: DetailOffsets;

  constructor(patterns: PatternTable, classCount: number, annotatorCount: number) {
    const k = classCount;
    const a = annotatorCount;
    this.classCount = k;
    this.annotatorCount = a;
    this.fleissM = chooseFleissM(patterns);
    const pairIds = new Map<number, number>();
    const pairA: number[] = [];
    const pairB: number[] = [];
    const { start, annotator, label, final } = patterns;
    for (let q = 0; q < patterns.size; q += 1) {
      for (let i = start[q]; i < start[q + 1]; i += 1) {
        for (let j = i + 1; j < start[q + 1]; j += 1) {
          const key = annotator[i] * a + annotator[j];
          if (!pairIds.has(key)) {
            pairIds.set(key, pairA.length);
            pairA.push(annotator[i]);
            pairB.push(annotator[j]);
          }
        }
      }
    }
    const pq = pairA.length;
    this.pairCount = pq;
    this.pairA = Int32Array.from(pairA);
    this.pairB = Int32Array.from(pairB);
    this.slotPair = 3;
    this.slotClass = this.slotPair + pq;
    this.slotVsOthers = this.slotClass + k;
    this.slotVsFinal = this.slotVsOthers + a;
    this.valueCount = this.slotVsFinal + a;
    this.off = detailOffsets(k, a, pq);
    this.main = new Float64Array(MAIN_FIXED + 2 * k);
    this.detail = new Float64Array(this.off.size);
    this.classValues = this.main.subarray(MAIN_FIXED, MAIN_FIXED + k);
    this.pairN = new Float64Array(pq);
    this.sharedN = new Float64Array(a);
    this.finalN = new Float64Array(a);
    this.finalAgree = this.detail.subarray(this.off.finalAgree, this.off.finalAgree + a);

    const mainRows = new SparseRowsBuilder();
    const detailRows = new SparseRowsBuilder();
    const off = this.off;
    const counts = new Int32Array(k);
    const distinct: number[] = [];
    for (let q = 0; q < patterns.size; q += 1) {
      const from = start[q];
      const to = start[q + 1];
      const m = to - from;
      distinct.length = 0;
      for (let j = from; j < to; j += 1) if (counts[label[j]]++ === 0) distinct.push(label[j]);
      if (m >= 2) {
        let agreePairs = 0;
        for (const c of distinct) agreePairs += counts[c] * (counts[c] - 1);
        mainRows.add(PAIRABLE, 1);
        mainRows.add(VALUES, m);
        mainRows.add(PERCENT, agreePairs / (m * (m - 1)));
        mainRows.add(SAME, agreePairs / (m - 1));
        for (const c of distinct) mainRows.add(MAIN_FIXED + c, counts[c]);
        if (m === this.fleissM) {
          mainRows.add(FLEISS_ITEMS, 1);
          mainRows.add(FLEISS_SUM, agreePairs / (m * (m - 1)));
          for (const c of distinct) mainRows.add(MAIN_FIXED + k + c, counts[c]);
        }
        for (const c of distinct) detailRows.add(off.classDisagree + c, (2 * counts[c] * (m - counts[c])) / (m - 1));
        for (let i = from; i < to; i += 1) {
          for (let j = i + 1; j < to; j += 1) {
            const id = pairIds.get(annotator[i] * a + annotator[j])!;
            detailRows.add(off.pairRow + id * k + label[i], 1);
            detailRows.add(off.pairCol + id * k + label[j], 1);
            if (label[i] === label[j]) detailRows.add(off.pairAgree + id, 1);
          }
        }
        for (let i = from; i < to; i += 1) {
          const r = annotator[i];
          detailRows.add(off.sharedOwn + r * k + label[i], 1);
          detailRows.add(off.sharedAgree + r, (counts[label[i]] - 1) / (m - 1));
          for (const c of distinct) detailRows.add(off.sharedOther + r * k + c, (counts[c] - (c === label[i] ? 1 : 0)) / (m - 1));
        }
      }
      const fin = final[q];
      if (fin >= 0) {
        for (let i = from; i < to; i += 1) {
          const r = annotator[i];
          detailRows.add(off.finalOwn + r * k + label[i], 1);
          detailRows.add(off.finalFin + r * k + fin, 1);
          if (label[i] === fin) detailRows.add(off.finalAgree + r, 1);
        }
      }
      for (const c of distinct) counts[c] = 0;
      mainRows.endRow();
      detailRows.endRow();
    }
    this.mainRows = mainRows.build();
    this.detailRows = detailRows.build();
  }

  /** Writes every coefficient (NaN where undefined) into `out` for the given weight per pattern. */
  evaluate(weights: Float64Array, out: Float64Array, detail: boolean): void {
    const k = this.classCount;
    const s = this.main;
    accumulate(this.mainRows, weights, s);
    this.pairableWeight = s[PAIRABLE];
    this.valuesWeight = s[VALUES];
    this.fleissWeight = s[FLEISS_ITEMS];
    const n = s[VALUES];
    out[SLOT_PERCENT] = s[PAIRABLE] > 0 ? s[PERCENT] / s[PAIRABLE] : NaN;
    // Krippendorff (2011), nominal: α = 1 − (n − 1)(n − Σc o_cc) / (n² − Σc n_c²).
    let sumSquares = 0;
    for (let c = 0; c < k; c += 1) sumSquares += s[MAIN_FIXED + c] * s[MAIN_FIXED + c];
    const alphaDen = n * n - sumSquares;
    out[SLOT_ALPHA] = n > 1 && alphaDen > 0 ? 1 - ((n - 1) * (n - s[SAME])) / alphaDen : NaN;
    // Fleiss (1971): κ = (P̄ − P̄e) / (1 − P̄e), P̄e = Σj p_j², p_j = share of all assignments to class j.
    const assignments = s[FLEISS_ITEMS] * this.fleissM;
    let expected = 0;
    for (let c = 0; c < k; c += 1) expected += (s[MAIN_FIXED + k + c] / assignments) ** 2;
    out[SLOT_FLEISS] =
      s[FLEISS_ITEMS] > 0 && 1 - expected > 1e-12 ? (s[FLEISS_SUM] / s[FLEISS_ITEMS] - expected) / (1 - expected) : NaN;
    if (detail) this.evaluateDetail(weights, out);
    else out.fill(NaN, this.slotPair);
  }

  private evaluateDetail(weights: Float64Array, out: Float64Array): void {
    const k = this.classCount;
    const d = this.detail;
    const off = this.off;
    accumulate(this.detailRows, weights, d);
    for (let id = 0; id < this.pairCount; id += 1) {
      let n = 0;
      for (let c = 0; c < k; c += 1) n += d[off.pairRow + id * k + c];
      this.pairN[id] = n;
      out[this.slotPair + id] = kappaFromMarginals(d[off.pairAgree + id], d, off.pairRow + id * k, off.pairCol + id * k, k);
    }
    const n = this.valuesWeight;
    for (let c = 0; c < k; c += 1) {
      const nc = this.classValues[c];
      // One-vs-rest nominal alpha: with two categories, n² − Σ n_c² = 2 n_c (n − n_c).
      out[this.slotClass + c] = n > 1 && nc > 0 && nc < n ? 1 - ((n - 1) * d[off.classDisagree + c]) / (2 * nc * (n - nc)) : NaN;
    }
    for (let r = 0; r < this.annotatorCount; r += 1) {
      let shared = 0;
      let fin = 0;
      for (let c = 0; c < k; c += 1) {
        shared += d[off.sharedOwn + r * k + c];
        fin += d[off.finalOwn + r * k + c];
      }
      this.sharedN[r] = shared;
      this.finalN[r] = fin;
      out[this.slotVsOthers + r] = kappaFromMarginals(d[off.sharedAgree + r], d, off.sharedOwn + r * k, off.sharedOther + r * k, k);
      out[this.slotVsFinal + r] = kappaFromMarginals(d[off.finalAgree + r], d, off.finalOwn + r * k, off.finalFin + r * k, k);
    }
  }
}
