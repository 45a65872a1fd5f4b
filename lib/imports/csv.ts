import { isUtf8 } from "node:buffer";
import { ImportFailure } from "./issues";
import { ByteRow } from "./row-values";
import { firstInvalidUtf8 } from "./text";

export const delimiters = [",", ";", "\t", "|"] as const;

function countOutsideQuotes(line: string, d: string): number {
  let n = 0;
  let quoted = false;
  for (let i = 0; i < line.length; i += 1) {
    const c = line[i];
    if (c === '"') quoted = !quoted;
    else if (!quoted && c === d) n += 1;
  }
  return n;
}

/** Picks the delimiter whose count per line is the same on most of the first lines, preferring more columns. */
export function sniffDelimiter(sample: string): string {
  const lines = sample.replace(/^\uFEFF/, "").split(/\r?\n/).slice(0, 30).filter((l) => l.length > 0);
  if (lines.length > 1 && !/\r?\n$/.test(sample)) lines.pop();
  let best = { d: ",", score: -1 };
  for (const d of delimiters) {
    const counts = lines.map((l) => countOutsideQuotes(l, d));
    const head = counts[0] ?? 0;
    if (head === 0) continue;
    const consistent = counts.filter((c) => c === head).length / counts.length;
    const score = consistent * 1000 + head;
    if (score > best.score) best = { d, score };
  }
  return best.d;
}

const QUOTE = 34;
const LF = 10;
const CR = 13;

/**
 * A streaming RFC 4180 reader over bytes: quoted fields (with "" escapes and line breaks), CRLF or LF,
 * blank lines skipped. Unquoted fields stay as byte ranges, so numbers are parsed without making strings.
 * Every byte it consumes is checked to be UTF-8.
 */
export class ByteCsvReader {
  private rest: Buffer | null = null;
  private records = 0;
  private consumed = 0;
  private first = true;
  private readonly d: number;

  constructor(delimiter: string, private readonly onRecord: (row: ByteRow) => void) {
    this.d = delimiter.charCodeAt(0);
  }

  push(chunk: Buffer) {
    if (this.first) {
      this.first = false;
      if (chunk.length >= 2 && ((chunk[0] === 0xff && chunk[1] === 0xfe) || (chunk[0] === 0xfe && chunk[1] === 0xff))) {
        throw new ImportFailure("The file is encoded as UTF-16. Save it as UTF-8 (with or without BOM) and upload it again.");
      }
      if (chunk[0] === 0xef && chunk[1] === 0xbb && chunk[2] === 0xbf) {
        chunk = chunk.subarray(3);
        this.consumed = 3;
      }
    }
    const buf = this.rest ? Buffer.concat([this.rest, chunk]) : chunk;
    const used = this.parse(buf, false);
    this.rest = used < buf.length ? buf.subarray(used) : null;
  }

  finish() {
    if (this.rest) this.parse(this.rest, true);
    this.rest = null;
  }

  private validate(buf: Buffer, end: number) {
    if (end === 0) return;
    const region = buf.subarray(0, end);
    if (!isUtf8(region)) {
      const at = Math.max(firstInvalidUtf8(region), 0);
      throw new ImportFailure(
        `The file is not valid UTF-8 (the first bad byte, 0x${region[at].toString(16).padStart(2, "0")}, is at byte ${this.consumed + at}, in row ${this.records}). It may be saved as Latin-1 or Windows-1252: save it as UTF-8 and upload it again.`,
      );
    }
  }

  /** Emits every complete record in buf; returns the bytes used. */
  private parse(buf: Buffer, final: boolean): number {
    const n = buf.length;
    const d = this.d;
    let bounds = new Int32Array(4096);
    let used = 0;
    let pos = 0;
    let nextQuote = buf.indexOf(QUOTE);
    if (nextQuote === -1) nextQuote = n;
    while (pos < n) {
      let nl = buf.indexOf(LF, pos);
      if (nl === -1) {
        if (!final) break;
        nl = n;
      }
      if (nextQuote < pos) {
        nextQuote = buf.indexOf(QUOTE, pos);
        if (nextQuote === -1) nextQuote = n;
      }
      let end = nl;
      if (end > pos && buf[end - 1] === CR) end -= 1;
      if (nextQuote >= nl) {
        if (end > pos) {
          if (used + 2 * 1024 > bounds.length) {
            bounds = new Int32Array(Math.max(4096, bounds.length));
            used = 0;
          }
          const base = used;
          let count = 0;
          let s = pos;
          for (let i = pos; i < end; i += 1) {
            if (buf[i] === d) {
              if (used + 2 > bounds.length) {
                const grown = new Int32Array(bounds.length * 2);
                grown.set(bounds);
                bounds = grown;
              }
              bounds[used++] = s;
              bounds[used++] = i;
              count += 1;
              s = i + 1;
            }
          }
          if (used + 2 > bounds.length) {
            const grown = new Int32Array(bounds.length * 2);
            grown.set(bounds);
            bounds = grown;
          }
          bounds[used++] = s;
          bounds[used++] = end;
          count += 1;
          this.records += 1;
          this.onRecord(new ByteRow(buf, bounds, base, count, null, this.d !== 44));
        }
        pos = nl + 1;
        continue;
      }
      const next = this.parseQuoted(buf, pos, final);
      if (next === -1) break;
      pos = next;
    }
    const checked = Math.min(pos, n);
    this.validate(buf, checked);
    this.consumed += checked;
    return checked;
  }

  /** One record holding a quote: builds its fields as strings. Returns the position after it, or -1 if the buffer ends first. */
  private parseQuoted(buf: Buffer, start: number, final: boolean): number {
    const d = this.d;
    const n = buf.length;
    const fields: string[] = [];
    let i = start;
    for (;;) {
      let field = "";
      if (buf[i] === QUOTE) {
        i += 1;
        for (;;) {
          const j = buf.indexOf(QUOTE, i);
          if (j === -1) {
            if (!final) return -1;
            throw new ImportFailure(`Row ${this.records}: a quoted field opens but never closes (a closing " is missing).`);
          }
          field += buf.toString("utf8", i, j);
          if (j + 1 >= n && !final) return -1;
          if (buf[j + 1] === QUOTE) {
            field += '"';
            i = j + 2;
          } else {
            i = j + 1;
            break;
          }
        }
      }
      const s = i;
      while (i < n && buf[i] !== d && buf[i] !== LF) i += 1;
      let e = i;
      if (buf[e - 1] === CR && buf[e] === LF && e > s) e -= 1;
      if (e > s) field += buf.toString("utf8", s, e);
      fields.push(field);
      if (i >= n && !final) return -1;
      if (i < n && buf[i] === d) {
        i += 1;
        continue;
      }
      this.records += 1;
      const quoted = new Map(fields.map((f, k) => [k, f]));
      this.onRecord(new ByteRow(buf, new Int32Array(fields.length * 2), 0, fields.length, quoted, this.d !== 44));
      return i + 1;
    }
  }
}
