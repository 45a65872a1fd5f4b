import type { DeskColumn } from "./types";

/** "flow_velocity_ms" with unit "m/s" reads "Flow velocity"; the unit is shown beside the value instead. */
export function fieldTitle(name: string, unit?: string): string {
  const parts = name.split(/[_\s]+/).filter(Boolean);
  if (unit && parts.length > 1 && parts[parts.length - 1].length <= 5) parts.pop();
  const text = parts.join(" ");
  return text.charAt(0).toUpperCase() + text.slice(1);
}

const numberFormat = new Intl.NumberFormat("en", { maximumFractionDigits: 3 });

export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return "—";
  return numberFormat.format(value);
}

export type FieldView = { name: string; title: string; kind: "number" | "category" | "text" | "list" | "missing"; value: string; unit?: string; raw: unknown };

/** Every field of an item, in the feature schema's order first, each with its kind and display text. */
export function fieldViews(fields: Record<string, unknown>, columns: DeskColumn[]): FieldView[] {
  const known = new Map(columns.map((c) => [c.name, c]));
  const names = [...columns.map((c) => c.name).filter((n) => n in fields), ...Object.keys(fields).filter((n) => !known.has(n))];
  return names.map((name) => {
    const raw = fields[name];
    const col = known.get(name);
    const unit = col?.unit;
    const title = fieldTitle(name, unit);
    if (raw == null || raw === "") return { name, title, kind: "missing", value: "missing", unit, raw };
    if (typeof raw === "number") return { name, title, kind: "number", value: formatNumber(raw), unit, raw };
    if (Array.isArray(raw)) return { name, title, kind: "list", value: `${raw.length} values`, raw };
    const text = String(raw);
    if (col?.kind === "categorical" || text.length <= 40) return { name, title, kind: "category", value: text, raw };
    return { name, title, kind: "text", value: text, raw };
  });
}

export function percent(share: number): string {
  return `${Math.round(share * 100)}%`;
}

export function formatDistance(d: number): string {
  if (!Number.isFinite(d)) return "—";
  return d >= 100 ? d.toFixed(0) : d >= 10 ? d.toFixed(1) : d.toFixed(2);
}

export function ageText(iso: string, now = Date.now()): string {
  const mins = Math.max(0, Math.round((now - new Date(iso).getTime()) / 60_000));
  if (mins < 1) return "just now";
  if (mins < 60) return `${mins} min ago`;
  const hours = Math.round(mins / 60);
  if (hours < 48) return `${hours} h ago`;
  return `${Math.round(hours / 24)} days ago`;
}
