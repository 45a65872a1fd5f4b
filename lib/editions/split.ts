import { mulberry32 } from "@/lib/random";
import type { SplitName, SplitOptions } from "./options";

export const SPLIT_TRAIN = 0;
export const SPLIT_VALIDATION = 1;
export const SPLIT_TEST = 2;
export const splitCodes: SplitName[] = ["train", "validation", "test"];

/**
 * Rows per part for a stratum of n rows: floor of each share, then the rows left over go to the parts
 * with the largest remainders (Hamilton's method); equal remainders go to train, then validation, then test.
 */
export function splitSizes(n: number, f: Pick<SplitOptions, "train" | "validation" | "test">): [number, number, number] {
  const exact = [n * f.train, n * f.validation, n * f.test];
  const sizes = exact.map(Math.floor) as [number, number, number];
  let left = n - sizes[0] - sizes[1] - sizes[2];
  const order = [0, 1, 2].sort((a, b) => exact[b] - sizes[b] - (exact[a] - sizes[a]) || a - b);
  for (let i = 0; left > 0; i = (i + 1) % 3, left -= 1) sizes[order[i]] += 1;
  return sizes;
}

/** A row's place in its stratum's shuffled order: one mulberry32 draw seeded by the split seed and the item id. */
export function splitKey(seed: number, itemId: number): number {
  return mulberry32((seed ^ Math.imul(itemId, 0x9e3779b1)) >>> 0)();
}

/**
 * Stratified split: within each stratum (the final label), rows are ordered by their seeded key (ties by
 * item id) and cut by `splitSizes`. The answer depends only on the set of (item id, stratum) pairs and the
 * seed, not on the order rows arrive in; an item keeps its part when others are added unless it sits at a cut.
 */
export function assignSplits({ ids, strata, options }: { ids: ArrayLike<number>; strata: ArrayLike<number>; options: SplitOptions }): Uint8Array {
  const n = ids.length;
  const out = new Uint8Array(n);
  const keys = new Float64Array(n);
  const byStratum = new Map<number, number[]>();
  for (let i = 0; i < n; i += 1) {
    keys[i] = splitKey(options.seed, ids[i]);
    const list = byStratum.get(strata[i]);
    if (list) list.push(i);
    else byStratum.set(strata[i], [i]);
  }
  for (const rows of byStratum.values()) {
    rows.sort((a, b) => keys[a] - keys[b] || ids[a] - ids[b]);
    const [train, validation] = splitSizes(rows.length, options);
    rows.forEach((row, rank) => {
      out[row] = rank < train ? SPLIT_TRAIN : rank < train + validation ? SPLIT_VALIDATION : SPLIT_TEST;
    });
  }
  return out;
}
