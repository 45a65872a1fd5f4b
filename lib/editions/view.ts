import type { EditionWithCreator } from "@/db/queries/editions";
import type { EditionManifest } from "./manifest";
import type { EditionOptions } from "./options";

export type EditionSummary = {
  id: number;
  number: number;
  status: "pending" | "running" | "succeeded" | "failed" | "cancelled";
  options: EditionOptions;
  message: string | null;
  createdAt: string;
  publishedAt: string | null;
  createdBy: { id: string; name: string | null } | null;
  rows: number | null;
  counts: Pick<EditionManifest["counts"], "byClass" | "bySource"> | null;
  files: Record<"csv" | "jsonl" | "parquet", { bytes: number; sha256: string }> | null;
};

export type EditionDetail = EditionSummary & { manifest: EditionManifest | null };

export function editionSummary(e: EditionWithCreator): EditionSummary {
  const m = e.manifest as EditionManifest | null;
  return {
    id: e.id,
    number: e.number,
    status: e.status,
    options: e.options as EditionOptions,
    message: e.message,
    createdAt: e.createdAt.toISOString(),
    publishedAt: e.publishedAt?.toISOString() ?? null,
    createdBy: e.creator ? { id: e.creator.id, name: e.creator.name } : null,
    rows: m?.counts.rows ?? null,
    counts: m ? { byClass: m.counts.byClass, bySource: m.counts.bySource } : null,
    files: m
      ? { csv: { bytes: m.files.csv.bytes, sha256: m.files.csv.sha256 }, jsonl: { bytes: m.files.jsonl.bytes, sha256: m.files.jsonl.sha256 }, parquet: { bytes: m.files.parquet.bytes, sha256: m.files.parquet.sha256 } }
      : null,
  };
}

export function editionDetail(e: EditionWithCreator): EditionDetail {
  return { ...editionSummary(e), manifest: (e.manifest as EditionManifest | null) ?? null };
}
