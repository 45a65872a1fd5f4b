import type { Upload } from "@/db/schema";
import type { FeatureSchema } from "@/lib/projects/settings";
import { detectColumns } from "./detect";
import { isTableName } from "./images";
import { ImportFailure } from "./issues";
import { limits } from "./limits";
import { isParquet, openParquet } from "./parquet";
import type { RowValues } from "./row-values";
import { openDelimited, openJsonLines } from "./sources";
import { getRange, objectAsyncBuffer } from "./storage";
import type { ColumnInfo, ImportFormat, RowSource } from "./types";
import { isZip } from "./zip";

export type TablePreview = { uploadId: string; fileName: string; delimiter?: string; columns: ColumnInfo[]; rows: string[][]; sampled: number };
export type Preview = {
  format: ImportFormat;
  table: TablePreview | null;
  images: { files: number; zips: number; names: string[] } | null;
  featureSchema: FeatureSchema | null;
};

const imageName = /\.(png|jpe?g|webp)$/i;

function cell(v: unknown): string {
  if (v === null || v === undefined) return "";
  const s = typeof v === "string" ? v : JSON.stringify(v);
  return s.length > 120 ? `${s.slice(0, 117)}…` : s;
}

async function sampleOf(source: RowSource, truncated: boolean): Promise<RowValues[]> {
  const rows: RowValues[] = [];
  for await (const batch of source.rows) {
    for (const r of batch) if (!r.error) rows.push(r.values);
    if (rows.length >= limits.sampleRows) break;
  }
  // A ranged read may cut the last line in half.
  if (truncated && rows.length > 1) rows.pop();
  return rows.slice(0, limits.sampleRows);
}

export function formatOf(upload: Pick<Upload, "fileName">, head: Uint8Array): ImportFormat | "image" | "zip" {
  if (isParquet(head) || /\.parquet$/i.test(upload.fileName)) return "parquet";
  if (isZip(head) || /\.zip$/i.test(upload.fileName)) return "zip";
  if (imageName.test(upload.fileName)) return "image";
  if (/\.(jsonl|ndjson)$/i.test(upload.fileName)) return "jsonl";
  return "csv";
}

async function previewTable(up: Upload, format: ImportFormat, labelNames: Set<string>): Promise<TablePreview> {
  let source: RowSource & { delimiter?: string };
  const truncated = up.size > limits.sampleBytes;
  if (format === "parquet") source = await openParquet(await objectAsyncBuffer(up.objectKey));
  else {
    const head = await getRange(up.objectKey, 0, Math.min(up.size, limits.sampleBytes));
    const once = (async function* () {
      yield head;
    })();
    source = format === "jsonl" ? await openJsonLines(once) : await openDelimited(once);
  }
  const rows = await sampleOf(source, truncated && format !== "parquet");
  const columns = detectColumns(source.columns, rows, labelNames);
  return {
    uploadId: up.id,
    fileName: up.fileName,
    delimiter: source.delimiter,
    columns,
    rows: rows.slice(0, limits.previewRows).map((r) => source.columns.map((_, i) => cell(r.raw(i)))),
    sampled: rows.length,
  };
}

/** What the owner sees before confirming: the format, the detected column roles, and the first rows. */
export async function previewUploads({ uploads, labelNames, featureSchema }: { uploads: Upload[]; labelNames: Set<string>; featureSchema: FeatureSchema | null }): Promise<Preview> {
  if (uploads.length === 0) throw new ImportFailure("Choose at least one uploaded file.");
  const kinds = await Promise.all(uploads.map(async (u) => ({ u, kind: formatOf(u, await getRange(u.objectKey, 0, Math.min(u.size, 8))) })));
  const visual = kinds.filter((k) => k.kind === "image" || k.kind === "zip");
  const tables = kinds.filter((k) => k.kind !== "image" && k.kind !== "zip");
  if (visual.length > 0) {
    if (tables.length > 1 || tables.some((t) => !isTableName(t.u.fileName))) {
      throw new ImportFailure("With images, add at most one CSV or JSON Lines file of embeddings keyed by file name.");
    }
    const table = tables[0] ? await previewTable(tables[0].u, tables[0].kind as ImportFormat, new Set()) : null;
    return {
      format: "images",
      table,
      images: { files: visual.filter((v) => v.kind === "image").length, zips: visual.filter((v) => v.kind === "zip").length, names: visual.slice(0, 20).map((v) => v.u.fileName) },
      featureSchema,
    };
  }
  if (uploads.length > 1) throw new ImportFailure("Import one table file at a time (or a set of images).");
  const format = tables[0].kind as ImportFormat;
  return { format, table: await previewTable(uploads[0], format, labelNames), images: null, featureSchema };
}
