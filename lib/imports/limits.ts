import { env } from "@/lib/env";

/** Import limits in one place (documented in docs/imports.md). */
export const limits = {
  uploadMaxBytes: env.UPLOAD_MAX_BYTES,
  maxColumns: env.IMPORT_MAX_COLUMNS,
  /** Files above this go up in parts. */
  multipartThreshold: 16 * 1024 * 1024,
  partSize: 8 * 1024 * 1024,
  batchMaxItems: 10_000,
  batchMaxBytes: 64 * 1024 * 1024,
  storedErrors: 100,
  /** The full error report stops growing here; the import has failed long before. */
  reportedErrors: 100_000,
  previewRows: 20,
  sampleRows: 1_000,
  sampleBytes: 1024 * 1024,
  maxIdLength: 500,
  maxVectorWidth: 65_536,
  zipMaxEntries: 100_000,
  zipMaxTotalBytes: 4 * 1024 * 1024 * 1024,
  zipMaxEntryBytes: 64 * 1024 * 1024,
  /** Inflated ÷ compressed above this (for entries over 1 MiB) is treated as a decompression bomb. */
  zipMaxRatio: 200,
  imageMaxPixels: 100_000_000,
} as const;
