import type { Proportion } from "./types";

const Z95 = 1.959963984540054;

/** Wilson (1927) score interval for a binomial proportion, 95% level. */
export function wilsonProportion(successes: number, total: number): Proportion {
  if (total <= 0) return { successes, total, value: null, ci95: null };
  const p = successes / total;
  const z2 = Z95 * Z95;
  const denom = 1 + z2 / total;
  const centre = (p + z2 / (2 * total)) / denom;
  const half = (Z95 * Math.sqrt((p * (1 - p)) / total + z2 / (4 * total * total))) / denom;
  return { successes, total, value: p, ci95: { lower: Math.max(0, centre - half), upper: Math.min(1, centre + half) } };
}
