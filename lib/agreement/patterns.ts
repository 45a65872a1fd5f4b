import type { RatingsInput } from "./types";
import { AgreementInputError } from "./validate";

/**
 * Items grouped by their full rating pattern: the list of (annotator, class) ratings in annotator order plus
 * the final label. Every statistic in this module is a sum over items of a function of the pattern, so a
 * resample of items is fully described by how many times it drew each pattern.
 */
export interface PatternTable {
  size: number;
  /** Occurrences of each pattern among the rated items. */
  count: Float64Array;
  /** Offsets into `annotator`/`label`: pattern p owns start[p]..start[p+1]-1. */
  start: Int32Array;
  annotator: Int32Array;
  label: Int32Array;
  final: Int32Array;
  /** Items with at least one rating (the units the bootstrap resamples). */
  ratedItems: number;
  /** Rating indices ordered by item, then annotator. */
  order: Int32Array;
  /** Offsets of each item's ratings in `order` (length itemCount + 1). */
  itemStart: Int32Array;
}

/** Stable counting sorts: by annotator, then by item, so each item's ratings come in annotator order. */
export function sortRatings(input: RatingsInput): { order: Int32Array; itemStart: Int32Array } {
  const { item, annotator, itemCount, annotatorCount } = input;
  const n = item.length;
  const annStart = new Int32Array(annotatorCount + 1);
  for (let r = 0; r < n; r += 1) annStart[annotator[r] + 1] += 1;
  for (let a = 0; a < annotatorCount; a += 1) annStart[a + 1] += annStart[a];
  const byAnnotator = new Int32Array(n);
  for (let r = 0; r < n; r += 1) byAnnotator[annStart[annotator[r]]++] = r;
  const itemStart = new Int32Array(itemCount + 1);
  for (let r = 0; r < n; r += 1) itemStart[item[r] + 1] += 1;
  for (let i = 0; i < itemCount; i += 1) itemStart[i + 1] += itemStart[i];
  const cursor = itemStart.slice(0, itemCount);
  const order = new Int32Array(n);
  for (let j = 0; j < n; j += 1) {
    const r = byAnnotator[j];
    order[cursor[item[r]]++] = r;
  }
  for (let i = 0; i < itemCount; i += 1) {
    for (let j = itemStart[i] + 1; j < itemStart[i + 1]; j += 1) {
      if (annotator[order[j]] === annotator[order[j - 1]]) {
        throw new AgreementInputError(`annotator ${annotator[order[j]]} rated item ${i} more than once`);
      }
    }
  }
  return { order, itemStart };
}

export function buildPatterns(input: RatingsInput, finalLabel: Int32Array | undefined): PatternTable {
  const { order, itemStart } = sortRatings(input);
  const { itemCount } = input;
  let rated = 0;
  for (let i = 0; i < itemCount; i += 1) if (itemStart[i + 1] > itemStart[i]) rated += 1;
  let capacity = 16;
  while (capacity < rated * 2) capacity *= 2;
  const mask = capacity - 1;
  const table = new Int32Array(capacity).fill(-1);
  const hashes = new Int32Array(rated);
  const count = new Float64Array(rated);
  const start = new Int32Array(rated + 1);
  const final = new Int32Array(rated);
  const annotatorSeq = new Int32Array(order.length);
  const labelSeq = new Int32Array(order.length);
  const ann = input.annotator;
  const lab = input.label;
  let size = 0;
  let used = 0;
  for (let i = 0; i < itemCount; i += 1) {
    const from = itemStart[i];
    const to = itemStart[i + 1];
    if (to === from) continue;
    const fin = finalLabel ? finalLabel[i] : -1;
    let h = Math.imul(fin + 0x5bd1e995, 0x01000193) ^ (to - from);
    for (let j = from; j < to; j += 1) {
      const r = order[j];
      h = Math.imul(h ^ ann[r], 0x01000193);
      h = Math.imul(h ^ lab[r], 0x01000193);
      h ^= h >>> 13;
    }
    let slot = h & mask;
    let found = -1;
    for (;;) {
      const p = table[slot];
      if (p === -1) break;
      if (hashes[p] === h && final[p] === fin && start[p + 1] - start[p] === to - from) {
        let same = true;
        for (let j = from, k = start[p]; j < to; j += 1, k += 1) {
          const r = order[j];
          if (annotatorSeq[k] !== ann[r] || labelSeq[k] !== lab[r]) {
            same = false;
            break;
          }
        }
        if (same) {
          found = p;
          break;
        }
      }
      slot = (slot + 1) & mask;
    }
    if (found === -1) {
      found = size;
      size += 1;
      table[slot] = found;
      hashes[found] = h;
      final[found] = fin;
      for (let j = from; j < to; j += 1) {
        annotatorSeq[used] = ann[order[j]];
        labelSeq[used] = lab[order[j]];
        used += 1;
      }
      start[found + 1] = used;
    }
    count[found] += 1;
  }
  return {
    size,
    count: count.slice(0, size),
    start: start.slice(0, size + 1),
    annotator: annotatorSeq.slice(0, used),
    label: labelSeq.slice(0, used),
    final: final.slice(0, size),
    ratedItems: rated,
    order,
    itemStart,
  };
}
