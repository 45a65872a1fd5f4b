import type { BandName, Coefficient, Interval } from "./types";

/**
 * Landis & Koch (1977), "The measurement of observer agreement for categorical data", Biometrics 33:159–174, Table on p. 165.
 * Edge rule: the value is first rounded to the two decimals that are shown, then the bands are the
 * half-open intervals (−∞, 0) poor, [0, 0.20] slight, (0.20, 0.40] fair, (0.40, 0.60] moderate,
 * (0.60, 0.80] substantial, (0.80, 1] almost perfect — so the band always matches the printed number.
 */
export const LANDIS_KOCH_BANDS: readonly { band: BandName; upTo: number; label: string }[] = [
  { band: "poor", upTo: -Infinity, label: "< 0.00" },
  { band: "slight", upTo: 0.2, label: "0.00–0.20" },
  { band: "fair", upTo: 0.4, label: "0.21–0.40" },
  { band: "moderate", upTo: 0.6, label: "0.41–0.60" },
  { band: "substantial", upTo: 0.8, label: "0.61–0.80" },
  { band: "almost perfect", upTo: Infinity, label: "0.81–1.00" },
];

/** The number as shown everywhere: two decimals, true minus sign. */
export function formatCoefficient(value: number): string {
  const text = value.toFixed(2);
  return text === "-0.00" ? "0.00" : text.replace("-", "−");
}

export function landisKochBand(value: number | null): BandName | null {
  if (value === null || !Number.isFinite(value)) return null;
  const shown = Number(value.toFixed(2));
  if (shown < 0) return "poor";
  if (shown <= 0.2) return "slight";
  if (shown <= 0.4) return "fair";
  if (shown <= 0.6) return "moderate";
  if (shown <= 0.8) return "substantial";
  return "almost perfect";
}

function formatInterval(ci: Interval, format: (v: number) => string): string {
  const joiner = ci.lower < 0 ? " to " : "–";
  return `95% CI ${format(ci.lower)}${joiner}${format(ci.upper)}`;
}

/**
 * Plain-language reading of a chance-corrected coefficient, e.g.
 * "moderate agreement (α = 0.55, 95% CI 0.49–0.61)". `symbol` is α or κ.
 */
export function describeCoefficient(
  symbol: string,
  value: number | null,
  ci95: Interval | null,
  noInterval = "too few items to resample",
): string {
  const band = landisKochBand(value);
  if (value === null || band === null) {
    return `agreement cannot be computed (${symbol} undefined: no item rated twice, or a single class used)`;
  }
  const shown = `${symbol} = ${formatCoefficient(value)}`;
  if (ci95 === null) return `${band} agreement (${shown}, no interval: ${noInterval})`;
  const low = landisKochBand(ci95.lower);
  const high = landisKochBand(ci95.upper);
  const spread = low !== high ? `; the interval spans ${low} to ${high}` : "";
  return `${band} agreement (${shown}, ${formatInterval(ci95, formatCoefficient)}${spread})`;
}

export function describePercent(value: number | null, ci95: Interval | null, noInterval = "too few items to resample"): string {
  if (value === null) return "percent agreement cannot be computed (no item rated twice)";
  const pct = (v: number) => `${(v * 100).toFixed(0)}%`;
  const ci = ci95 === null ? `no interval: ${noInterval}` : formatInterval(ci95, pct);
  return `raters agree on ${pct(value)} of rating pairs (${ci}; not corrected for chance)`;
}

export function coefficient(symbol: string, value: number | null, ci95: Interval | null, noInterval?: string): Coefficient {
  return { value, ci95, band: landisKochBand(value), reading: describeCoefficient(symbol, value, ci95, noInterval) };
}
