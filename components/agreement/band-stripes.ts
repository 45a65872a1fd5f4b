import type { Interval } from "@/lib/agreement";
import { formatCoefficient } from "@/lib/agreement/bands";

/** Landis & Koch (1977) bands as background stripes behind interval charts (Agreement page and dashboard). */
export const bandStripes = [
  { from: -1, to: 0, name: "poor", fill: "#fbeae6" },
  { from: 0, to: 0.2, name: "slight", fill: "#fbf3e2" },
  { from: 0.2, to: 0.4, name: "fair", fill: "#f7ebcf" },
  { from: 0.4, to: 0.6, name: "moderate", fill: "#f1eee7" },
  { from: 0.6, to: 0.8, name: "substantial", fill: "#e3efec" },
  { from: 0.8, to: 1, name: "almost perfect", fill: "#d3e6e2" },
] as const;

/** Left end of a coefficient axis: the lowest estimate or lower bound, floored to a step of 0.2, at most `atMost`, never below −1. */
export function axisStart(figures: ReadonlyArray<{ value: number | null; ci95: Interval | null }>, atMost: number): number {
  const lows = figures.flatMap((f) => [f.value, f.ci95?.lower]).filter((v): v is number => typeof v === "number");
  return Math.max(-1, Math.min(atMost, ...lows.map((v) => Math.floor(v * 5) / 5)));
}

/** ", 95% CI 0.41 to 0.62" or ", no interval": the interval part of a chart's spoken summary. */
export const intervalPhrase = (ci: Interval | null) => (ci ? `, 95% CI ${formatCoefficient(ci.lower)} to ${formatCoefficient(ci.upper)}` : ", no interval");
