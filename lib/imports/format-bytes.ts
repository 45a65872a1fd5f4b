/** "1.5 MB": decimal units, as file managers show sizes. */
export function formatBytes(n: number): string {
  if (n < 1000) return `${n} B`;
  const units = ["kB", "MB", "GB", "TB"];
  let v = n;
  let u = -1;
  do {
    v /= 1000;
    u += 1;
  } while (v >= 1000 && u < units.length - 1);
  return `${v >= 10 ? v.toFixed(0) : v.toFixed(1)} ${units[u]}`;
}
