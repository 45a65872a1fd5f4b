import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { ByteCsvReader, sniffDelimiter } from "@/lib/imports/csv";
import { ImportFailure } from "@/lib/imports/issues";
import { fastNumber } from "@/lib/imports/row-values";
import { openDelimited } from "@/lib/imports/sources";
import type { SourceRow } from "@/lib/imports/types";

const fx = (name: string) => `tests/fixtures/imports/${name}`;

function readAll(text: string | Buffer, delimiter = ",", chunk = 3): string[][] {
  const out: string[][] = [];
  const r = new ByteCsvReader(delimiter, (row) => out.push(Array.from({ length: row.length }, (_, i) => row.raw(i) ?? "")));
  const buf = Buffer.isBuffer(text) ? text : Buffer.from(text);
  for (let i = 0; i < buf.length; i += chunk) r.push(buf.subarray(i, i + chunk));
  r.finish();
  return out;
}

async function rowsOf(file: string): Promise<{ columns: string[]; rows: SourceRow[]; delimiter: string }> {
  const src = await openDelimited(fs.createReadStream(file, { highWaterMark: 7 }) as unknown as AsyncIterable<Buffer>);
  const rows: SourceRow[] = [];
  for await (const b of src.rows) rows.push(...b);
  return { columns: src.columns, rows, delimiter: src.delimiter };
}

describe("CSV reading", () => {
  // Cases from RFC 4180 §2 (quoted fields, "" escapes, line breaks inside quotes, CRLF).
  it("reads RFC 4180 quoting in any chunking", () => {
    const text = 'a,b,c\r\n"x, y","say ""hi""","two\r\nlines"\r\n1,,3\r\n';
    for (const chunk of [1, 2, 5, 1000]) {
      expect(readAll(text, ",", chunk)).toEqual([["a", "b", "c"], ["x, y", 'say "hi"', "two\r\nlines"], ["1", "", "3"]]);
    }
  });

  it("skips blank lines and reads a last line without a newline", () => {
    expect(readAll("a,b\n\n1,2\n\n3,4")).toEqual([["a", "b"], ["1", "2"], ["3", "4"]]);
  });

  it("sniffs comma, semicolon, tab and pipe", () => {
    expect(sniffDelimiter("a,b,c\n1,2,3\n")).toBe(",");
    expect(sniffDelimiter("a;b;c\n1,5;2;3\n")).toBe(";");
    expect(sniffDelimiter("a\tb\n1\t2\n")).toBe("\t");
    expect(sniffDelimiter("a|b|c\n1|2|3\n")).toBe("|");
    expect(sniffDelimiter('name,"x;y"\n"a;b",2\n')).toBe(",");
  });

  it("reads the fixture files with their delimiters, BOM and quoted line breaks", async () => {
    const csv = await rowsOf(fx("samples.csv"));
    expect(csv.columns).toEqual(["sample_id", "depth_m", "salinity", "site", "note", "label"]);
    expect(csv.rows).toHaveLength(6);
    expect(csv.rows[2].values.raw(4)).toBe("two\nlines");
    expect(csv.rows[5].values.raw(4)).toBe('said "ok"');
    const semi = await rowsOf(fx("samples-semicolon.csv"));
    expect(semi.delimiter).toBe(";");
    expect(semi.columns[0]).toBe("sample_id");
    expect(semi.rows[0].values.raw(1)).toBe("1,5");
    expect((await rowsOf(fx("samples.tsv"))).delimiter).toBe("\t");
    expect((await rowsOf(fx("samples-pipe.csv"))).rows).toHaveLength(2);
  });

  it("rejects invalid UTF-8 and UTF-16 with the byte position", async () => {
    await expect(rowsOf(fx("malformed/latin1.csv"))).rejects.toThrow(/not valid UTF-8 \(the first bad byte, 0xfc, is at byte 23/);
    await expect(rowsOf(fx("malformed/utf16.csv"))).rejects.toThrow(/UTF-16/);
    await expect(rowsOf(fx("malformed/empty.csv"))).rejects.toThrow(ImportFailure);
  });

  it("rejects a quote that never closes", () => {
    expect(() => readAll('a,b\n"open,2\n')).toThrow(/never closes/);
  });
});

describe("fastNumber", () => {
  it("matches Number() exactly wherever it answers", () => {
    const cases = ["0", "-0.5", "12.25", "3.14159265358979", "1e5", "-2.5E-3", "+7", "123456789012345", "0.1", "0.30000000000000004", ".5", "5."];
    for (const s of cases) {
      const b = Buffer.from(s);
      const v = fastNumber(b, 0, b.length);
      if (!Number.isNaN(v)) expect(v).toBe(Number(s));
    }
    // Random decimals, checked against the engine's own parser.
    let seed = 7;
    for (let i = 0; i < 20_000; i += 1) {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      const s = ((seed / 2147483648 - 0.5) * 10 ** ((seed % 9) - 3)).toFixed(seed % 8);
      const b = Buffer.from(s);
      const v = fastNumber(b, 0, b.length);
      expect(Number.isNaN(v) ? Number(s) : v).toBe(Number(s));
    }
  });

  it("gives NaN (fall back) for what it does not handle", () => {
    for (const s of ["n/a", "1.2.3", "0x10", "12345678901234567", "1e400", "", "-", "e5"]) {
      const b = Buffer.from(s);
      expect(Number.isNaN(fastNumber(b, 0, b.length))).toBe(true);
    }
  });
});
