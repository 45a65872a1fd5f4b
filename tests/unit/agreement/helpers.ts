import type { AgreementInput } from "@/lib/agreement";

/** Collects (item, annotator, label) ratings and packs them as lib/agreement's long-format input. */
function ratings() {
  const item: number[] = [];
  const annotator: number[] = [];
  const label: number[] = [];
  return {
    add(u: number, a: number, c: number) {
      item.push(u);
      annotator.push(a);
      label.push(c);
    },
    input(itemCount: number, annotatorCount: number, classCount: number): AgreementInput {
      return { itemCount, annotatorCount, classCount, item: Int32Array.from(item), annotator: Int32Array.from(annotator), label: Int32Array.from(label) };
    },
  };
}

/** Long-format input from a rater × unit matrix (null = missing), classes given as 0-based indices. */
export function fromMatrix(matrix: (number | null)[][], classCount: number): AgreementInput {
  const out = ratings();
  matrix.forEach((row, a) =>
    row.forEach((value, u) => {
      if (value !== null) out.add(u, a, value);
    }),
  );
  return out.input(matrix[0].length, matrix.length, classCount);
}

/** Long-format input from per-subject category counts (Fleiss' layout): rater identities are arbitrary. */
export function fromCounts(counts: number[][]): AgreementInput {
  const out = ratings();
  let raters = 0;
  counts.forEach((row, i) => {
    let a = 0;
    row.forEach((n, c) => {
      for (let j = 0; j < n; j += 1) {
        out.add(i, a, c);
        a += 1;
      }
    });
    raters = Math.max(raters, a);
  });
  return out.input(counts.length, raters, counts[0].length);
}

/** Two raters' long-format input from a square contingency table (rows: rater 0, columns: rater 1). */
export function fromTable(table: number[][]): AgreementInput {
  const out = ratings();
  let u = 0;
  table.forEach((row, r) =>
    row.forEach((n, c) => {
      for (let j = 0; j < n; j += 1) {
        out.add(u, 0, r);
        out.add(u, 1, c);
        u += 1;
      }
    }),
  );
  return out.input(u, 2, table.length);
}
