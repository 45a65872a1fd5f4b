import { describe, expect, it } from "vitest";
import { computeAgreement, createRandom, percentileInterval, quantileSorted } from "@/lib/agreement";
import { binomial } from "@/lib/agreement/binomial";
import { PatternResampler } from "@/lib/agreement/resample";

/** Pearson chi-square of draws against the exact Binomial(n, p) pmf, cells with expectation < 5 pooled. */
function chiSquare(n: number, p: number, draws: number, seed: number): { chi2: number; df: number; min: number; max: number } {
  const random = createRandom(seed);
  const observed = new Float64Array(n + 1);
  let min = n;
  let max = 0;
  for (let i = 0; i < draws; i += 1) {
    const x = binomial(n, p, random);
    observed[x] += 1;
    min = Math.min(min, x);
    max = Math.max(max, x);
  }
  let chi2 = 0;
  let cells = 0;
  let pooledExpected = 0;
  let pooledObserved = 0;
  let lnPmf = n * Math.log1p(-p);
  const lnOdds = Math.log(p / (1 - p));
  for (let k = 0; k <= n; k += 1) {
    const expected = Math.exp(lnPmf) * draws;
    if (expected >= 5) {
      chi2 += (observed[k] - expected) ** 2 / expected;
      cells += 1;
    } else {
      pooledExpected += expected;
      pooledObserved += observed[k];
    }
    lnPmf += Math.log((n - k) / (k + 1)) + lnOdds;
  }
  chi2 += (pooledObserved - pooledExpected) ** 2 / pooledExpected;
  return { chi2, df: cells, min, max };
}

describe("exact binomial sampler (inversion; BTRD after Hörmann 1993)", () => {
  // Upper 0.1% points of chi-square are below df + 3.1·√(2·df) + 10 for these df; a wrong sampler
  // (e.g. a normal approximation) overshoots by far at 40 000 draws.
  it.each([
    [20, 0.3],
    [60, 0.5],
    [400, 0.3],
    [5000, 0.93],
    [100_000, 0.0005],
    [20_000, 0.2],
  ])("Binomial(%d, %d) fits the exact pmf (Pearson chi-square)", (n, p) => {
    const { chi2, df, min, max } = chiSquare(n, p, 40_000, n + Math.round(p * 1000));
    expect(min).toBeGreaterThanOrEqual(0);
    expect(max).toBeLessThanOrEqual(n);
    expect(chi2).toBeLessThan(df + 3.1 * Math.sqrt(2 * df) + 10);
  });

});

describe("pattern resampler (binomials for frequent patterns, item draws for rare ones)", () => {
  it("draws as many items as there are, with the multinomial's means and variances", () => {
    // Patterns seen 500, 300, 150, 40 times go through binomials; 9 and 1 (and 0) through item draws.
    const counts = new Float64Array([500, 300, 150, 40, 9, 1, 0]);
    const total = 1000;
    const resampler = new PatternResampler(counts, 4);
    const weights = new Float64Array(counts.length);
    const sum = new Float64Array(counts.length);
    const sumSq = new Float64Array(counts.length);
    const draws = 5000;
    for (let b = 0; b < draws; b += 1) {
      resampler.draw(weights);
      expect(weights.reduce((s, v) => s + v, 0)).toBe(total);
      weights.forEach((v, i) => {
        sum[i] += v;
        sumSq[i] += v * v;
      });
    }
    counts.forEach((c, i) => {
      const mean = sum[i] / draws;
      const variance = sumSq[i] / draws - mean * mean;
      const p = c / total;
      // Multinomial: mean N·p, variance N·p·(1 − p); tolerances are about 4 standard errors.
      expect(Math.abs(mean - c)).toBeLessThanOrEqual(4 * Math.sqrt((total * p * (1 - p)) / draws) + 1e-9);
      expect(Math.abs(variance - total * p * (1 - p))).toBeLessThanOrEqual(0.1 * total * p * (1 - p) + 1e-9);
    });
  });
});

describe("percentile interval", () => {
  it("uses Hyndman & Fan (1996) type 7 quantiles (R's default): quantile(1:10, c(.025, .975)) = 1.225, 9.775", () => {
    const sorted = Float64Array.from({ length: 10 }, (_, i) => i + 1);
    expect(quantileSorted(sorted, 0.025)).toBeCloseTo(1.225, 12);
    expect(quantileSorted(sorted, 0.975)).toBeCloseTo(9.775, 12);
  });

  it("ignores undefined resamples but gives no interval when more than 5% are undefined", () => {
    const values = Float64Array.from({ length: 100 }, (_, i) => i);
    values[0] = NaN;
    expect(percentileInterval(values)).not.toBeNull();
    values.fill(NaN, 0, 6);
    expect(percentileInterval(values)).toBeNull();
  });
});

describe("bootstrap width against the binomial standard error", () => {
  // Two raters: percent agreement is the share p of agreeing items; its standard error is √(p(1−p)/n),
  // so the 95% interval is about 2 · 1.96 · SE wide.
  function twoRaterData(items: number, annotators: number, seed: number) {
    const random = createRandom(seed);
    const item: number[] = [];
    const annotator: number[] = [];
    const label: number[] = [];
    for (let u = 0; u < items; u += 1) {
      const first = Math.floor(random() * annotators);
      const second = (first + 1 + Math.floor(random() * (annotators - 1))) % annotators;
      const a = Math.floor(random() * 2);
      const b = random() < 0.7 ? a : 1 - a;
      item.push(u, u);
      annotator.push(first, second);
      label.push(a, b);
    }
    return { itemCount: items, annotatorCount: annotators, classCount: 2, item: Int32Array.from(item), annotator: Int32Array.from(annotator), label: Int32Array.from(label) };
  }

  it.each([
    ["few, frequent patterns (binomial draws)", 2],
    ["mostly distinct patterns (item draws)", 400],
  ])("%s", (_, annotators) => {
    const report = computeAgreement(twoRaterData(3000, annotators, 12), { resamples: 400, seed: 2, detailIntervals: false });
    const p = report.percentAgreement.value!;
    const expectedWidth = 2 * 1.96 * Math.sqrt((p * (1 - p)) / 3000);
    const ci = report.percentAgreement.ci95!;
    expect(ci.upper - ci.lower).toBeGreaterThan(0.85 * expectedWidth);
    expect(ci.upper - ci.lower).toBeLessThan(1.15 * expectedWidth);
  });
});
