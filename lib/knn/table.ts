import type { TableInput } from "./preprocess";

/** A problem with the user's table (missing column, non-numeric value, …): a message worth showing. */
export class TableError extends Error {}

export interface FeatureColumn {
  name: string;
  kind: "numeric" | "categorical";
}

/** Empty (after trimming) = missing → NaN; otherwise a finite number, or undefined if not one. */
export function parseNumber(raw: string | undefined): number | undefined {
  const s = (raw ?? "").trim();
  if (s === "") return Number.NaN;
  const v = Number(s);
  return Number.isFinite(v) ? v : undefined;
}

/**
 * Feature columns of a table: every column but the excluded ones (id, label). A column is numeric
 * when every non-empty value parses as a finite number, categorical (one-hot) otherwise.
 */
export function planFeatures(columns: readonly string[], rows: readonly Record<string, string>[], exclude: readonly string[]): FeatureColumn[] {
  return columns
    .filter((name) => !exclude.includes(name))
    .map((name) => ({
      name,
      kind: rows.every((r) => parseNumber(r[name]) !== undefined) ? ("numeric" as const) : ("categorical" as const),
    }));
}

/** Rows → the engine's TableInput for the planned features; `what` names the source in errors. */
export function toTableInput(features: readonly FeatureColumn[], rows: readonly Record<string, string>[], what: string): TableInput {
  const numericCols = features.filter((f) => f.kind === "numeric");
  const categoricalCols = features.filter((f) => f.kind === "categorical");
  const w = numericCols.length;
  const numeric = new Float32Array(rows.length * w);
  rows.forEach((row, i) => {
    numericCols.forEach((col, j) => {
      const v = parseNumber(row[col.name]);
      if (v === undefined) {
        throw new TableError(`${what} row ${i + 2}, column '${col.name}': '${row[col.name]}' is not a number (the column is numeric)`);
      }
      numeric[i * w + j] = v;
    });
  });
  const categorical = categoricalCols.map((col) =>
    rows.map((row) => {
      const v = (row[col.name] ?? "").trim();
      return v === "" ? null : v;
    }),
  );
  return { n: rows.length, numeric, numericWidth: w, categorical };
}
