import type { SuggestionSnapshot } from "@/db/schema";
import { unpackFloat32 } from "@/lib/random";
import type { FeatureColumnPlan } from "./columns";
import { type CsvValue, csvLine } from "./csv";
import { shortestFloat32 } from "./float";
import type { IncludeSource, SplitName } from "./options";

/** One exported item as the snapshot query reads it. */
export type SourceItem = {
  id: number;
  externalId: string;
  fields: Record<string, unknown>;
  vector: Buffer | Uint8Array | null;
  isBlind: boolean;
  isControl: boolean;
  classId: number | null;
  source: IncludeSource;
  labels: Array<{ annotatorId: string; email: string | null; classId: number; suggestion: SuggestionSnapshot | null }>;
};

export type FeatureValue = number | string | boolean | null | Array<number | null> | Record<string, unknown> | unknown[];

/** One row of an edition, the same in every file format. */
export type EditionRow = {
  external_id: string;
  split: SplitName | null;
  final_label: string | null;
  label_source: IncludeSource;
  is_blind: boolean;
  is_control: boolean;
  features: Record<string, FeatureValue>;
  /** Annotator (id or e-mail) → the class they gave. */
  labels: Record<string, string>;
  /** Annotator → the vote shares (class → share) of the suggestion on screen when they labelled; blind labels have none. */
  vote_shares: Record<string, Record<string, number>>;
};

export type RowContext = { classNames: Map<number, string>; features: FeatureColumnPlan[]; identity: "id" | "email" };

function featureValues(item: SourceItem, plan: FeatureColumnPlan[]): Record<string, FeatureValue> {
  const vec = item.vector ? unpackFloat32(item.vector) : null;
  const out: Record<string, FeatureValue> = {};
  for (const c of plan) {
    const raw = item.fields[c.name];
    if (c.kind === "numeric") {
      out[c.name] = typeof raw === "number" ? raw : vec && c.offset < vec.length ? shortestFloat32(vec[c.offset]) : null;
    } else if (c.kind === "vector") {
      if (!vec) out[c.name] = Array.isArray(raw) ? (raw as unknown[]) : null;
      else out[c.name] = Array.from(vec.subarray(c.offset, c.width === null ? vec.length : c.offset + c.width), (x) => shortestFloat32(x));
    } else if (c.kind === "categorical") {
      out[c.name] = raw === null || raw === undefined ? null : String(raw);
    } else {
      out[c.name] = raw === undefined ? null : (raw as FeatureValue);
    }
  }
  return out;
}

export function buildRow(item: SourceItem, split: SplitName | null, ctx: RowContext): EditionRow {
  const labels: Record<string, string> = {};
  const shares: Record<string, Record<string, number>> = {};
  for (const l of item.labels) {
    const who = ctx.identity === "email" && l.email ? l.email : l.annotatorId;
    const name = ctx.classNames.get(l.classId);
    if (name !== undefined) labels[who] = name;
    if (l.suggestion?.shown) {
      const named: Record<string, number> = {};
      for (const [classId, share] of Object.entries(l.suggestion.shares ?? {})) {
        const className = ctx.classNames.get(Number(classId));
        if (className !== undefined && typeof share === "number") named[className] = share;
      }
      shares[who] = named;
    }
  }
  return {
    external_id: item.externalId,
    split,
    final_label: item.classId === null ? null : (ctx.classNames.get(item.classId) ?? null),
    label_source: item.source,
    is_blind: item.isBlind,
    is_control: item.isControl,
    features: featureValues(item, ctx.features),
    labels,
    vote_shares: shares,
  };
}

/** A feature value as one CSV or Parquet text cell: vectors and objects as JSON. */
export function featureText(value: FeatureValue): string | null {
  if (value === null || value === undefined) return null;
  if (typeof value === "string") return value;
  return JSON.stringify(value);
}

export function csvRow(row: EditionRow, features: FeatureColumnPlan[], annotators: string[]): string {
  const cells: CsvValue[] = [row.external_id, row.split, row.final_label, row.label_source, row.is_blind, row.is_control];
  for (const c of features) {
    const v = row.features[c.name];
    cells.push(typeof v === "number" || typeof v === "boolean" ? v : featureText(v));
  }
  for (const a of annotators) cells.push(row.labels[a] ?? null);
  cells.push(Object.keys(row.vote_shares).length ? JSON.stringify(row.vote_shares) : null);
  return csvLine(cells);
}

export function jsonlRow(row: EditionRow): string {
  return `${JSON.stringify(row)}\n`;
}
