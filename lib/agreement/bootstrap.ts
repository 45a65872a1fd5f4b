import type { AgreementEngine } from "./engine";
import type { PatternTable } from "./patterns";
import { PatternResampler } from "./resample";
import type { Interval } from "./types";

/** A resample's interval is reported only when the coefficient is defined in at least this share of resamples. */
export const MIN_DEFINED_SHARE = 0.95;

/** Hyndman & Fan (1996) type 7 quantile (linear interpolation between order statistics) of sorted values. */
export function quantileSorted(sorted: Float64Array, p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

/** Percentile 95% interval: the 2.5% and 97.5% quantiles of the defined (finite) resample values. */
export function percentileInterval(values: Float64Array): Interval | null {
  let defined = 0;
  for (let i = 0; i < values.length; i += 1) if (Number.isFinite(values[i])) defined += 1;
  if (values.length === 0 || defined < MIN_DEFINED_SHARE * values.length) return null;
  const sorted = new Float64Array(defined);
  let j = 0;
  for (let i = 0; i < values.length; i += 1) if (Number.isFinite(values[i])) sorted[j++] = values[i];
  sorted.sort();
  return { lower: quantileSorted(sorted, 0.025), upper: quantileSorted(sorted, 0.975) };
}

/**
 * Nonparametric bootstrap over items (Efron 1979): each resample draws as many items as were rated, uniformly
 * with replacement, and every coefficient is then a weighted sum over the distinct rating patterns
 * (PatternResampler draws how often each pattern is picked). Returns one interval (or null) per engine slot.
 */
export function bootstrapIntervals(
  engine: AgreementEngine,
  patterns: PatternTable,
  resamples: number,
  seed: number,
  detail: boolean,
): (Interval | null)[] {
  const intervals = new Array<Interval | null>(engine.valueCount).fill(null);
  if (resamples <= 0) return intervals;
  const slots = detail ? engine.valueCount : 3;
  const resampler = new PatternResampler(patterns.count, seed);
  const weights = new Float64Array(patterns.size);
  const out = new Float64Array(engine.valueCount);
  const bySlot = new Float64Array(slots * resamples);
  for (let b = 0; b < resamples; b += 1) {
    resampler.draw(weights);
    engine.evaluate(weights, out, detail);
    for (let s = 0; s < slots; s += 1) bySlot[s * resamples + b] = out[s];
  }
  for (let s = 0; s < slots; s += 1) intervals[s] = percentileInterval(bySlot.subarray(s * resamples, (s + 1) * resamples));
  return intervals;
}
