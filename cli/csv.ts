import { readFileSync } from "node:fs";
import Papa from "papaparse";
import { CliError } from "./errors";

export interface CsvTable {
  columns: string[];
  rows: Record<string, string>[];
}

/** Reads a CSV file with a header row; every value stays a string. */
export function readCsv(path: string): CsvTable {
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new CliError(code === "ENOENT" ? `file not found: ${path}` : `cannot read ${path}: ${(error as Error).message}`);
  }
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: true });
  const fatal = parsed.errors.find((e) => e.type !== "Delimiter");
  if (fatal) throw new CliError(`${path}: CSV error on row ${(fatal.row ?? 0) + 2}: ${fatal.message}`);
  const columns = (parsed.meta.fields ?? []).map((c) => c.trim());
  if (columns.length === 0) throw new CliError(`${path}: no header row`);
  const seen = new Set<string>();
  for (const c of columns) {
    if (seen.has(c)) throw new CliError(`${path}: column '${c}' appears twice`);
    seen.add(c);
  }
  const rows = parsed.data.map((r) => {
    const out: Record<string, string> = {};
    for (const [k, v] of Object.entries(r)) out[k.trim()] = v ?? "";
    return out;
  });
  return { columns, rows };
}

/** Throws unless the table has the column. */
export function requireColumn(table: CsvTable, column: string, path: string, role: string): void {
  if (!table.columns.includes(column)) {
    throw new CliError(`${path} has no ${role} column '${column}' (columns: ${table.columns.join(", ")})`);
  }
}

export interface LabelledTable {
  table: CsvTable;
  ids: string[];
  /** Sorted distinct labels: the label set; class index = position. */
  classes: string[];
  classIndex: Int32Array;
}

/** Reads the labelled file: id and label columns required, every row labelled. */
export function readLabelled(path: string, idColumn: string, labelColumn: string): LabelledTable {
  const table = readCsv(path);
  requireColumn(table, idColumn, path, "id");
  requireColumn(table, labelColumn, path, "label");
  if (table.rows.length === 0) throw new CliError(`${path} has no rows`);
  const labels = table.rows.map((r, i) => {
    const label = (r[labelColumn] ?? "").trim();
    if (label === "") throw new CliError(`${path} row ${i + 2} has no label in column '${labelColumn}'`);
    return label;
  });
  const classes = [...new Set(labels)].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const at = new Map(classes.map((c, i) => [c, i]));
  return {
    table,
    ids: table.rows.map((r) => r[idColumn]),
    classes,
    classIndex: Int32Array.from(labels, (l) => at.get(l)!),
  };
}
