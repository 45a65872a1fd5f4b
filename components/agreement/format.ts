import { type BandName, formatCoefficient, type Interval, type Proportion } from "@/lib/agreement";

export const coef = (v: number | null) => (v === null ? "—" : formatCoefficient(v));

export function coefInterval(ci: Interval | null): string {
  if (!ci) return "no interval";
  return `${formatCoefficient(ci.lower)}${ci.lower < 0 ? " to " : "–"}${formatCoefficient(ci.upper)}`;
}

export const pct = (v: number | null, digits = 0) => (v === null ? "—" : `${(v * 100).toFixed(digits)}%`);

export function pctInterval(ci: Interval | null): string {
  return ci ? `${pct(ci.lower)}–${pct(ci.upper)}` : "no interval";
}

/** "41 of 50 (82%, 95% CI 69%–90%)", or a plain "none yet". */
export function describeProportion(p: Proportion): string {
  if (p.total === 0 || p.value === null) return "none yet";
  return `${p.successes} of ${p.total} (${pct(p.value)}, 95% CI ${pctInterval(p.ci95)})`;
}

/** Band tints: cool pine for strong agreement, amber for weak, alarm red below chance. */
export const bandTone: Record<BandName, { chip: string; fill: string; text: string }> = {
  poor: { chip: "border-alarm-500/40 bg-alarm-50 text-alarm-700", fill: "#fbeae6", text: "#8a2f1f" },
  slight: { chip: "border-amber-500/40 bg-amber-50 text-amber-700", fill: "#fbf3e2", text: "#8a6216" },
  fair: { chip: "border-amber-500/60 bg-amber-100 text-amber-700", fill: "#f5e2b8", text: "#8a6216" },
  moderate: { chip: "border-line-strong bg-paper-sunk text-ink", fill: "#ece8df", text: "#1d2433" },
  substantial: { chip: "border-pine-500/40 bg-pine-100 text-pine-900", fill: "#cfe3df", text: "#0e2e2f" },
  "almost perfect": { chip: "border-pine-700 bg-pine-600 text-white", fill: "#1f5f5b", text: "#ffffff" },
};

export const dateTime = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" }) + " UTC";
