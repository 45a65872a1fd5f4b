import type { RatingsInput } from "./types";
import { AgreementInputError } from "./validate";

export interface RatingRow {
  item: string;
  annotator: string;
  label: string;
}

export interface EncodedRatings {
  input: RatingsInput;
  /** Names by index. Items keep first-seen order; annotators and classes are sorted (code-point order). */
  items: string[];
  annotators: string[];
  classes: string[];
  /** Rows dropped because they repeated an earlier (item, annotator, label) row exactly. */
  repeatedRows: number;
}

const byCodePoint = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/**
 * Maps named long-format rows to dense indices. An exact repeat of a row is dropped; the same
 * (item, annotator) pair with two different labels throws AgreementInputError.
 */
export function encodeRatings(rows: readonly RatingRow[]): EncodedRatings {
  const itemIndex = new Map<string, number>();
  const annotatorSet = new Set<string>();
  const classSet = new Set<string>();
  const seen = new Map<string, { label: string; row: number }>();
  const kept: RatingRow[] = [];
  let repeatedRows = 0;
  rows.forEach((row, index) => {
    const key = JSON.stringify([row.item, row.annotator]);
    const earlier = seen.get(key);
    if (earlier) {
      if (earlier.label !== row.label) {
        throw new AgreementInputError(
          `annotator '${row.annotator}' labelled item '${row.item}' twice with different labels ('${earlier.label}' on row ${earlier.row + 1}, '${row.label}' on row ${index + 1})`,
        );
      }
      repeatedRows += 1;
      return;
    }
    seen.set(key, { label: row.label, row: index });
    if (!itemIndex.has(row.item)) itemIndex.set(row.item, itemIndex.size);
    annotatorSet.add(row.annotator);
    classSet.add(row.label);
    kept.push(row);
  });
  const annotators = [...annotatorSet].sort(byCodePoint);
  const classes = [...classSet].sort(byCodePoint);
  const annotatorIndex = new Map(annotators.map((name, i) => [name, i]));
  const classIndex = new Map(classes.map((name, i) => [name, i]));
  const input: RatingsInput = {
    itemCount: itemIndex.size,
    annotatorCount: annotators.length,
    classCount: classes.length,
    item: Int32Array.from(kept, (r) => itemIndex.get(r.item)!),
    annotator: Int32Array.from(kept, (r) => annotatorIndex.get(r.annotator)!),
    label: Int32Array.from(kept, (r) => classIndex.get(r.label)!),
  };
  return { input, items: [...itemIndex.keys()], annotators, classes, repeatedRows };
}
