import type { AgreementInput } from "@/lib/agreement";

/** Long-format input from a rater × unit matrix (null = missing), classes given as 0-based indices. */
export function fromMatrix(matrix: (number | null)[][], classCount: number): AgreementInput {
  const item: number[] = [];
  const annotator: number[] = [];
  const label: number[] = [];
  matrix.forEach((row, a) =>
    row.forEach((value, u) => {
      if (value === null) return;
      item.push(u);
      annotator.push(a);
      label.push(value);
    }),
  );
  return {
    itemCount: matrix[0].length,
    annotatorCount: matrix.length,
    classCount,
    item: Int32Array.from(item),
    annotator: Int32Array.from(annotator),
    label: Int32Array.from(label),
  };
}

/** Long-format input from per-subject category counts (Fleiss' layout): rater identities are arbitrary. */
export function fromCounts(counts: number[][]): AgreementInput {
  const item: number[] = [];
  const annotator: number[] = [];
  const label: number[] = [];
  let raters = 0;
  counts.forEach((row, i) => {
    let a = 0;
    row.forEach((n, c) => {
      for (let j = 0; j < n; j += 1) {
        item.push(i);
        annotator.push(a);
        label.push(c);
        a += 1;
      }
    });
    raters = Math.max(raters, a);
  });
  return {
    itemCount: counts.length,
    annotatorCount: raters,
    classCount: counts[0].length,
    item: Int32Array.from(item),
    annotator: Int32Array.from(annotator),
    label: Int32Array.from(label),
  };
}

/** Two raters' long-format input from a square contingency table (rows: rater 0, columns: rater 1). */
export function fromTable(table: number[][]): AgreementInput {
  const item: number[] = [];
  const annotator: number[] = [];
  const label: number[] = [];
  let u = 0;
  table.forEach((row, r) =>
    row.forEach((n, c) => {
      for (let j = 0; j < n; j += 1) {
        item.push(u, u);
        annotator.push(0, 1);
        label.push(r, c);
        u += 1;
      }
    }),
  );
  return {
    itemCount: u,
    annotatorCount: 2,
    classCount: table.length,
    item: Int32Array.from(item),
    annotator: Int32Array.from(annotator),
    label: Int32Array.from(label),
  };
}
