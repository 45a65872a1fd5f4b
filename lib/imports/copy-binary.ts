import os from "node:os";

const signature = Buffer.from("PGCOPY\n\xff\r\n\0", "latin1");
const littleEndian = os.endianness() === "LE";

/**
 * Builds PostgreSQL binary COPY data (header, tuples, trailer) into reusable chunks.
 * Field layouts per the PostgreSQL manual, "COPY — Binary Format": int16 field count, then per field an int32 length (-1 = NULL) and the bytes.
 */
export class BinaryCopyWriter {
  private buf: Buffer;
  private pos = 0;

  constructor(private readonly chunkSize = 1 << 20) {
    this.buf = Buffer.allocUnsafe(chunkSize);
    signature.copy(this.buf, 0);
    this.buf.writeInt32BE(0, 11);
    this.buf.writeInt32BE(0, 15);
    this.pos = 19;
  }

  get size() {
    return this.pos;
  }

  private ensure(n: number) {
    if (this.pos + n <= this.buf.length) return;
    const next = Buffer.allocUnsafe(Math.max(this.buf.length * 2, this.pos + n));
    this.buf.copy(next, 0, 0, this.pos);
    this.buf = next;
  }

  startRow(fields: number) {
    this.ensure(2);
    this.buf.writeInt16BE(fields, this.pos);
    this.pos += 2;
  }

  nullField() {
    this.ensure(4);
    this.buf.writeInt32BE(-1, this.pos);
    this.pos += 4;
  }

  int4(v: number | null) {
    if (v === null) return this.nullField();
    this.ensure(8);
    this.buf.writeInt32BE(4, this.pos);
    this.buf.writeInt32BE(v, this.pos + 4);
    this.pos += 8;
  }

  text(s: string | null) {
    if (s === null) return this.nullField();
    const max = s.length * 3;
    this.ensure(4 + max);
    const n = this.buf.write(s, this.pos + 4, "utf8");
    this.buf.writeInt32BE(n, this.pos);
    this.pos += 4 + n;
  }

  uuid(id: string | null) {
    if (id === null) return this.nullField();
    this.ensure(20);
    this.buf.writeInt32BE(16, this.pos);
    this.buf.write(id.replace(/-/g, ""), this.pos + 4, 16, "hex");
    this.pos += 20;
  }

  /** jsonb's binary form: a version byte (1) then the JSON text. */
  jsonb(json: string) {
    const max = json.length * 3 + 1;
    this.ensure(4 + max);
    this.buf[this.pos + 4] = 1;
    const n = this.buf.write(json, this.pos + 5, "utf8");
    this.buf.writeInt32BE(n + 1, this.pos);
    this.pos += 5 + n;
  }

  /** bytea of little-endian float32s. */
  float32Bytes(v: Float32Array | null) {
    if (v === null) return this.nullField();
    const n = v.length * 4;
    this.ensure(4 + n);
    this.buf.writeInt32BE(n, this.pos);
    this.pos += 4;
    if (littleEndian) {
      this.buf.set(new Uint8Array(v.buffer, v.byteOffset, n), this.pos);
    } else {
      for (let i = 0; i < v.length; i += 1) this.buf.writeFloatLE(v[i], this.pos + i * 4);
    }
    this.pos += n;
  }

  /** Hands over what is written so far and starts a fresh chunk. */
  take(final = false): Buffer {
    if (final) {
      this.ensure(2);
      this.buf.writeInt16BE(-1, this.pos);
      this.pos += 2;
    }
    const out = this.buf.subarray(0, this.pos);
    this.buf = Buffer.allocUnsafe(this.chunkSize);
    this.pos = 0;
    return out;
  }
}

/** Packs a float32 vector as the little-endian bytes `items.vector` holds. */
export function packVector(v: Float32Array): Buffer {
  const out = Buffer.allocUnsafe(v.length * 4);
  for (let i = 0; i < v.length; i += 1) out.writeFloatLE(v[i], i * 4);
  return out;
}

export function unpackVector(bytes: Uint8Array): Float32Array {
  const out = new Float32Array(bytes.byteLength / 4);
  const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  for (let i = 0; i < out.length; i += 1) out[i] = dv.getFloat32(i * 4, true);
  return out;
}
