/** A number parsed from a cell, or why it is not one. */
export type Parsed = number | "missing" | "bad" | "huge";

const missingWord = /^[-+]?(nan|inf|infinity)$/i;

/** Parses one cell as a float32: numbers pass, "" / NaN / ±Infinity are missing, anything else is not a number. */
export function parseNumber(value: unknown): Parsed {
  let v: number;
  if (typeof value === "number") v = value;
  else if (typeof value === "string") {
    if (value === "") return "missing";
    v = +value;
    if (v === 0 && value.trim() === "") return "missing";
    if (Number.isNaN(v)) return missingWord.test(value.trim()) ? "missing" : "bad";
  } else if (value === null || value === undefined) return "missing";
  else return "bad";
  if (!Number.isFinite(v)) return "missing";
  if (!Number.isFinite(Math.fround(v))) return "huge";
  return v;
}

/** The cells of one source row: raw values for display and ids, numbers for features. */
export interface RowValues {
  readonly length: number;
  raw(i: number): unknown;
  num(i: number): Parsed;
}

export class ArrayRow implements RowValues {
  constructor(private readonly values: readonly unknown[]) {}
  get length() {
    return this.values.length;
  }
  raw(i: number) {
    return this.values[i];
  }
  num(i: number) {
    return parseNumber(this.values[i]);
  }
}

const pow10 = Array.from({ length: 23 }, (_, i) => 10 ** i);

/**
 * Parses [-+]digits[.digits][(e|E)[-+]digits] from bytes when the result is exactly what Number() gives:
 * at most 15 significant digits and a power of ten up to 10^22, so one correctly rounded multiply or divide
 * of exact doubles (Clinger 1990, "How to read floating point numbers accurately", the fast path). Else NaN (caller falls back).
 */
export function fastNumber(b: Uint8Array, s: number, e: number): number {
  let i = s;
  let neg = false;
  let c = b[i];
  if (c === 45 || c === 43) {
    neg = c === 45;
    i += 1;
  }
  let mant = 0;
  let digits = 0;
  let frac = 0;
  const start = i;
  while (i < e && (c = b[i]) >= 48 && c <= 57) {
    mant = mant * 10 + (c - 48);
    if (mant !== 0) digits += 1;
    i += 1;
  }
  let sawDigits = i > start;
  if (i < e && b[i] === 46) {
    i += 1;
    const fs = i;
    while (i < e && (c = b[i]) >= 48 && c <= 57) {
      mant = mant * 10 + (c - 48);
      if (mant !== 0) digits += 1;
      frac += 1;
      i += 1;
    }
    sawDigits ||= i > fs;
  }
  if (!sawDigits) return Number.NaN;
  let exp = 0;
  if (i < e && (b[i] === 101 || b[i] === 69)) {
    i += 1;
    let eneg = false;
    if (b[i] === 45 || b[i] === 43) {
      eneg = b[i] === 45;
      i += 1;
    }
    const es = i;
    while (i < e && (c = b[i]) >= 48 && c <= 57 && i - es < 4) {
      exp = exp * 10 + (c - 48);
      i += 1;
    }
    if (i === es) return Number.NaN;
    if (eneg) exp = -exp;
  }
  if (i !== e || digits > 15) return Number.NaN;
  const p = exp - frac;
  let v: number;
  if (p === 0) v = mant;
  else if (p < 0 && p >= -22) v = mant / pow10[-p];
  else if (p > 0 && p <= 22) v = mant * pow10[p];
  else return Number.NaN;
  return neg ? -v : v;
}

/** One CSV record read from bytes: field bounds live in a shared Int32Array; quoted fields arrive unescaped. */
export class ByteRow implements RowValues {
  constructor(
    private readonly buf: Buffer,
    private readonly bounds: Int32Array,
    private readonly base: number,
    readonly length: number,
    private readonly quoted: Map<number, string> | null,
    private readonly decimalComma = false,
  ) {}

  raw(i: number): string | undefined {
    if (i >= this.length) return undefined;
    const q = this.quoted?.get(i);
    if (q !== undefined) return q;
    const k = this.base + 2 * i;
    return this.buf.toString("utf8", this.bounds[k], this.bounds[k + 1]);
  }

  num(i: number): Parsed {
    if (i >= this.length) return "missing";
    if (this.quoted?.has(i)) {
      const text = this.quoted.get(i)!;
      const p = parseNumber(text);
      if (p === "bad" && this.decimalComma && /^\s*[-+]?\d*,\d+\s*$/.test(text)) return parseNumber(text.replace(",", "."));
      return p;
    }
    const k = this.base + 2 * i;
    const s = this.bounds[k];
    const e = this.bounds[k + 1];
    if (s === e) return "missing";
    const v = fastNumber(this.buf, s, e);
    if (v === v) return Number.isFinite(Math.fround(v)) ? v : "huge";
    const text = this.buf.toString("utf8", s, e);
    const p = parseNumber(text);
    // With a semicolon, tab or pipe delimiter, "1,5" is a decimal comma.
    if (p === "bad" && this.decimalComma && /^\s*[-+]?\d*,\d+\s*$/.test(text)) return parseNumber(text.replace(",", "."));
    return p;
  }
}
