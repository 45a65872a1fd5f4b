/** The engine's seeded PRNG (mulberry32), shared by demo data, splits and benchmarks. */
export { mulberry32 } from "@/lib/knn/scores";

/** Standard normal draws by the Box–Muller transform. */
export function normal(rand: () => number) {
  let u = 0;
  while (u === 0) u = rand();
  const v = rand();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

export function packFloat32(values: ArrayLike<number>): Buffer {
  const f = new Float32Array(values.length);
  for (let i = 0; i < values.length; i += 1) f[i] = values[i];
  return Buffer.from(f.buffer, f.byteOffset, f.byteLength);
}

export function unpackFloat32(buf: Buffer | Uint8Array): Float32Array {
  const copy = new Uint8Array(buf.byteLength);
  copy.set(buf);
  return new Float32Array(copy.buffer);
}
