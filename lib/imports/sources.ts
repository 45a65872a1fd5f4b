import { ByteCsvReader, sniffDelimiter } from "./csv";
import { ArrayRow, type ByteRow } from "./row-values";
import { ImportFailure } from "./issues";
import { limits } from "./limits";
import { Utf8Decoder } from "./text";
import type { RowSource, SourceRow } from "./types";

const BATCH = 2_000;

type ByteStream = AsyncIterable<Uint8Array | Buffer | string>;

function checkHeader(header: string[]): string[] {
  if (header.length > limits.maxColumns) {
    throw new ImportFailure(`The file has ${header.length} columns; the limit is ${limits.maxColumns}. Put wide vectors in one array column, or split the file.`);
  }
  const names = header.map((h, i) => h.trim() || `column_${i + 1}`);
  const seen = new Map<string, number>();
  names.forEach((name, i) => {
    const before = seen.get(name);
    if (before !== undefined) throw new ImportFailure(`The header names column \`${name}\` twice (columns ${before + 1} and ${i + 1}). Rename one of them.`, name);
    seen.set(name, i);
  });
  return names;
}

/** Reads the first record of a delimited text stream as its header; yields the rest in batches. */
export async function openDelimited(stream: ByteStream, opts: { delimiter?: string } = {}): Promise<RowSource & { delimiter: string }> {
  const it = stream[Symbol.asyncIterator]();
  let bytes = 0;
  let done = false;
  const head: Buffer[] = [];
  let headBytes = 0;
  const next = async (): Promise<Buffer | null> => {
    const r = await it.next();
    if (r.done) {
      done = true;
      return null;
    }
    const chunk = typeof r.value === "string" ? Buffer.from(r.value) : Buffer.isBuffer(r.value) ? r.value : Buffer.from(r.value.buffer, r.value.byteOffset, r.value.byteLength);
    bytes += chunk.length;
    return chunk;
  };
  // Enough to sniff the delimiter and hold the header line.
  while (!done && headBytes < 64 * 1024) {
    const chunk = await next();
    if (!chunk) break;
    head.push(chunk);
    headBytes += chunk.length;
  }
  const first = Buffer.concat(head);
  const sample = new TextDecoder("utf-8").decode(first.subarray(0, 64 * 1024));
  if (sample.replace(/^\uFEFF/, "").trim().length === 0) throw new ImportFailure("The file is empty: there is no header and no rows.");
  const delimiter = opts.delimiter ?? sniffDelimiter(sample);
  let pending: ByteRow[] = [];
  const reader = new ByteCsvReader(delimiter, (r) => pending.push(r));
  reader.push(first);
  if (done) reader.finish();
  while (pending.length === 0 && !done) {
    const chunk = await next();
    if (chunk) reader.push(chunk);
    else reader.finish();
  }
  const headerRow = pending.shift();
  if (!headerRow) throw new ImportFailure("The file is empty: there is no header and no rows.");
  const columns = checkHeader(Array.from({ length: headerRow.length }, (_, i) => headerRow.raw(i) ?? ""));
  let row = 0;
  const toRows = (records: ByteRow[]): SourceRow[] => records.map((values) => ({ row: ++row, values }));
  // Read-ahead in 1 MiB slices keeps the per-chunk overhead small.
  let carry: Buffer[] = [];
  let carryBytes = 0;

  async function* rows(): AsyncGenerator<SourceRow[]> {
    while (pending.length > BATCH) yield toRows(pending.splice(0, BATCH));
    while (!done) {
      const chunk = await next();
      if (chunk) {
        carry.push(chunk);
        carryBytes += chunk.length;
        if (carryBytes < 1 << 20) continue;
        reader.push(carry.length === 1 ? carry[0] : Buffer.concat(carry));
      } else {
        if (carry.length) reader.push(Buffer.concat(carry));
        reader.finish();
      }
      carry = [];
      carryBytes = 0;
      while (pending.length >= BATCH) yield toRows(pending.splice(0, BATCH));
    }
    if (pending.length) {
      const out = pending;
      pending = [];
      yield toRows(out);
    }
  }

  return { columns, total: null, rows: rows(), bytesRead: () => bytes, delimiter };
}

/** JSON Lines: one object per line; columns come from the caller (the confirmed mapping) or from the sample. */
export async function openJsonLines(stream: ByteStream, opts: { columns?: string[] } = {}): Promise<RowSource> {
  const it = stream[Symbol.asyncIterator]();
  const decoder = new Utf8Decoder();
  let bytes = 0;
  let rest = "";
  let done = false;
  let lineNo = 0;
  const parsed: Array<{ row: number; obj?: Record<string, unknown>; error?: string }> = [];
  const pushText = (text: string, final: boolean) => {
    const s = rest + text;
    const lines = s.split("\n");
    rest = final ? "" : (lines.pop() ?? "");
    for (const raw of lines) {
      const line = raw.trim();
      if (!line) continue;
      lineNo += 1;
      try {
        const value = JSON.parse(line) as unknown;
        if (!value || typeof value !== "object" || Array.isArray(value)) throw new Error("the line is not a JSON object");
        parsed.push({ row: lineNo, obj: value as Record<string, unknown> });
      } catch (error) {
        parsed.push({ row: lineNo, error: (error as Error).message });
      }
    }
  };
  const pull = async () => {
    const r = await it.next();
    if (r.done) {
      done = true;
      pushText(decoder.end(), true);
      return;
    }
    const chunk = typeof r.value === "string" ? Buffer.from(r.value) : r.value;
    const first = bytes === 0;
    bytes += chunk.length;
    const text = decoder.decode(chunk);
    pushText(first ? text.replace(/^\uFEFF/, "") : text, false);
  };
  let columns = opts.columns;
  if (!columns) {
    while (!done && parsed.length < limits.sampleRows) await pull();
    const keys = new Set<string>();
    for (const r of parsed) if (r.obj) for (const k of Object.keys(r.obj)) keys.add(k);
    columns = [...keys];
  }
  if (!done && parsed.length === 0) await pull();
  if (done && parsed.length === 0 && lineNo === 0) throw new ImportFailure("The file is empty: there are no JSON lines.");
  const names = checkHeader(columns);
  const project = (r: (typeof parsed)[number]): SourceRow =>
    r.obj ? { row: r.row, values: new ArrayRow(names.map((c) => r.obj?.[c])) } : { row: r.row, values: new ArrayRow([]), error: r.error };
  async function* rows(): AsyncGenerator<SourceRow[]> {
    for (;;) {
      if (parsed.length >= BATCH || (done && parsed.length)) yield parsed.splice(0, BATCH).map(project);
      if (done && parsed.length === 0) return;
      if (!done && parsed.length < BATCH) await pull();
    }
  }
  return { columns: names, total: null, rows: rows(), bytesRead: () => bytes };
}

