import { z } from "zod";
import type { RowValues } from "./row-values";

/** What a source column means to Vicinal. `ignore` drops it; `text` keeps it for display only. */
export const columnRoles = ["id", "numeric", "categorical", "vector", "text", "prior_label", "ignore"] as const;
export type ColumnRole = (typeof columnRoles)[number];
export const columnRoleSchema = z.enum(columnRoles);

export const importFormats = ["csv", "jsonl", "parquet", "images"] as const;
export type ImportFormat = (typeof importFormats)[number];

/** One column as the preview shows it: the detected role, and the vector length for array columns. */
export type ColumnInfo = {
  name: string;
  detected: ColumnRole;
  /** Elements per value, for vector columns. */
  width?: number;
  distinct: number;
  empty: number;
  samples: string[];
};

export const roleMappingSchema = z.array(
  z.object({ name: z.string().min(1).max(200), role: columnRoleSchema, width: z.number().int().min(1).max(65_536).optional() }),
);
export type RoleMapping = z.infer<typeof roleMappingSchema>;

/** Options stored on `imports.options` and read by the job. */
export const importOptionsSchema = z.object({
  columns: roleMappingSchema.default([]),
  delimiter: z.string().length(1).optional(),
  /** For image imports: an embeddings file (CSV/JSONL) keyed by file name that replaces the pixel vector. */
  embeddingsUploadId: z.string().uuid().optional(),
  embeddingsColumns: roleMappingSchema.optional(),
});
export type ImportOptions = z.infer<typeof importOptionsSchema>;

export type ImportIssue = { row: number | null; column: string | null; message: string };

/** A row a source yields: its 1-based data row number and its cells in header order (or why it could not be read). */
export type SourceRow = { row: number; values: RowValues; error?: string };

export type RowSource = {
  columns: string[];
  /** Total data rows when the format knows it up front (Parquet), else null. */
  total: number | null;
  rows: AsyncIterable<SourceRow[]>;
  /** Bytes consumed so far, for progress on streamed text formats. */
  bytesRead(): number;
};

/** A row ready for staging: vector packed as little-endian float32. */
export type StagedItem = {
  row: number;
  externalId: string;
  fields: Record<string, unknown>;
  vector: Float32Array | null;
  priorClassId: number | null;
  imageKey?: string | null;
  thumbKey?: string | null;
};
