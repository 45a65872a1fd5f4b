/** The shortest decimal that reads back as the same float32 (so 2.35f prints as 2.35, not 2.3499999046325684). */
export function shortestFloat32(x: number): number | null {
  if (!Number.isFinite(x)) return null;
  const f = Math.fround(x);
  for (let p = 1; p < 10; p += 1) {
    const candidate = Number(f.toPrecision(p));
    if (Math.fround(candidate) === f) return candidate;
  }
  return f;
}
