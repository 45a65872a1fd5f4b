import type { Interval } from "@/lib/agreement";
import type { ProgressStatus } from "./rules";

export const int = (n: number) => n.toLocaleString("en");

export const pct = (v: number | null, digits = 0) => (v === null || !Number.isFinite(v) ? "—" : `${(v * 100).toFixed(digits)}%`);

export const pctInterval = (ci: Interval | null) => (ci ? `${pct(ci.lower)}–${pct(ci.upper)}` : "no interval");

/** "3 h", "2.5 days", "6 weeks": ages of open disputes. */
export function ageText(hours: number): string {
  if (hours < 1) return `${Math.max(1, Math.round(hours * 60))} min`;
  if (hours < 48) return `${Math.round(hours)} h`;
  const days = hours / 24;
  if (days < 14) return `${days.toFixed(days < 10 ? 1 : 0)} days`;
  return `${Math.round(days / 7)} weeks`;
}

/** "12 Mar" from "2025-03-12" (a calendar day; no time zone shift). */
export function shortDay(day: string): string {
  const [y, m, d] = day.split("-").map(Number);
  return new Date(Date.UTC(y, m - 1, d)).toLocaleDateString("en-GB", { day: "numeric", month: "short", timeZone: "UTC" });
}

export const statusLook: Record<ProgressStatus, { label: string; fill: string; text: string; hint: string }> = {
  unlabelled: { label: "Unlabelled", fill: "#e4dfd4", text: "#4a5263", hint: "no label yet, nobody holding it" },
  in_progress: { label: "In progress", fill: "#d9a441", text: "#1d2433", hint: "some labels, or open on a Desk now" },
  agreed: { label: "Agreed", fill: "#2b7a73", text: "#ffffff", hint: "annotators gave one class" },
  ruled: { label: "Ruled", fill: "#17494a", text: "#ffffff", hint: "a reviewer's Ruling settled it" },
  disputed: { label: "Disputed", fill: "#b4442f", text: "#ffffff", hint: "waiting in Disputes" },
  control: { label: "Control", fill: "#6b7282", text: "#ffffff", hint: "known label, checks annotators" },
};

/** Rail order: finished work from the left, open work to the right. */
export const railOrder: ProgressStatus[] = ["agreed", "ruled", "disputed", "in_progress", "unlabelled", "control"];

/** Annotator series colours (not class colours): distinct in hue and lightness. */
export const annotatorPalette = ["#1f5f5b", "#d9a441", "#b4442f", "#4f6fa8", "#7aa36b", "#8a5a9e", "#c47a4a", "#4a5263"];
export const othersColour = "#b9b1a2";

export const axis = { tick: { fontSize: 11, fill: "#4a5263" }, stroke: "#b9b1a2" };
export const gridStroke = "#e4dfd4";
export const tooltipStyle = { background: "#fffdf8", border: "1px solid #d9d3c7", borderRadius: 6, fontSize: 12 };
