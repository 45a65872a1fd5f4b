import { cachedAsyncBuffer, parquetMetadataAsync, parquetReadObjects, parquetSchema, type AsyncBuffer } from "hyparquet";
import { ImportFailure } from "./issues";
import { limits } from "./limits";
import { ArrayRow } from "./row-values";
import type { RowSource, SourceRow } from "./types";

const BATCH = 5_000;

function plain(value: unknown): unknown {
  if (typeof value === "bigint") return Number(value);
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) return Array.from(value as unknown as ArrayLike<number>, (v) => plain(v));
  if (Array.isArray(value)) return value.map(plain);
  if (value instanceof Date) return value.toISOString();
  return value;
}

/** Reads a Parquet file in row batches through hyparquet (uncompressed or Snappy pages). */
export async function openParquet(file: AsyncBuffer): Promise<RowSource> {
  const cached = cachedAsyncBuffer(file);
  let metadata: Awaited<ReturnType<typeof parquetMetadataAsync>>;
  try {
    metadata = await parquetMetadataAsync(cached);
  } catch (error) {
    throw new ImportFailure(`The file is not a readable Parquet file (${(error as Error).message}).`);
  }
  const columns = parquetSchema(metadata).children.map((c) => c.element.name);
  if (columns.length > limits.maxColumns) throw new ImportFailure(`The file has ${columns.length} columns; the limit is ${limits.maxColumns}.`);
  const total = Number(metadata.num_rows);
  if (total === 0) throw new ImportFailure("The Parquet file has columns but no rows.");
  let read = 0;
  async function* rows(): AsyncGenerator<SourceRow[]> {
    for (let start = 0; start < total; start += BATCH) {
      const end = Math.min(total, start + BATCH);
      let objects: Record<string, unknown>[];
      try {
        objects = await parquetReadObjects({ file: cached, metadata, rowStart: start, rowEnd: end });
      } catch (error) {
        throw new ImportFailure(`Rows ${start + 1}–${end} of the Parquet file could not be read (${(error as Error).message}).`);
      }
      read = end;
      yield objects.map((o, i) => ({ row: start + i + 1, values: new ArrayRow(columns.map((c) => plain(o[c]))) }));
    }
  }
  return { columns, total, rows: rows(), bytesRead: () => Math.round((read / total) * file.byteLength) };
}

export function isParquet(head: Uint8Array): boolean {
  return head.length >= 4 && head[0] === 0x50 && head[1] === 0x41 && head[2] === 0x52 && head[3] === 0x31;
}
