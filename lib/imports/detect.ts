import { parseNumber, type RowValues } from "./row-values";
import type { ColumnInfo, ColumnRole } from "./types";

const idName = /(^|_)(id|uuid|key)$|^(file|file_?name|filename|path)$/i;
const labelName = /^(label|class|prior|prior_?label|category|target|y)$/i;

function asArray(v: unknown): unknown[] | null {
  if (Array.isArray(v)) return v;
  if (typeof v === "string") {
    const t = v.trim();
    if (t.startsWith("[") && t.endsWith("]")) {
      const inner = t.slice(1, -1).trim();
      return inner === "" ? [] : inner.split(/[\s,;]+/);
    }
  }
  return null;
}

/**
 * Suggests a role per column from a sample: an array in every filled cell → vector; all numbers → numeric
 * (an id-like name with unique integers → id); a label-like name whose values are label classes → prior label;
 * unique strings → id (the first such column); few distinct values → categorical; else text.
 */
export function detectColumns(columns: string[], rows: RowValues[], labelNames: Set<string>): ColumnInfo[] {
  let idTaken = false;
  const infos = columns.map((name, c): ColumnInfo & { unique: boolean } => {
    const raws = rows.map((r) => r.raw(c));
    const filled = raws.filter((v) => v !== null && v !== undefined && v !== "");
    const strings = filled.map((v) => (typeof v === "string" ? v : JSON.stringify(v)));
    const distinct = new Set(strings).size;
    const samples = strings.slice(0, 5).map((s) => (s.length > 80 ? `${s.slice(0, 77)}…` : s));
    const base = { name, distinct, empty: raws.length - filled.length, samples, unique: distinct === filled.length && filled.length > 0 };
    if (filled.length === 0) return { ...base, detected: "ignore" };
    const arrays = filled.map(asArray);
    if (arrays.every((a) => a !== null && a.length > 1)) {
      const widths = new Set(arrays.map((a) => a!.length));
      return { ...base, detected: "vector", width: Math.max(...widths) };
    }
    const numbers = rows.map((r) => r.num(c));
    const allNumeric = numbers.every((n) => n !== "bad" && n !== "huge") && numbers.some((n) => typeof n === "number");
    let detected: ColumnRole;
    if (labelName.test(name) && filled.every((v) => labelNames.has(String(v).trim()))) detected = "prior_label";
    else if (allNumeric) detected = idName.test(name) && base.unique ? "id" : "numeric";
    else if (base.unique && (idName.test(name) || filled.length >= 5)) detected = "id";
    else if (distinct <= Math.max(2, Math.min(50, filled.length / 2))) detected = "categorical";
    else detected = "text";
    return { ...base, detected };
  });
  // One id at most: keep the first id-named one (else the first), demote the rest.
  for (const info of [...infos].sort((a, b) => Number(idName.test(b.name)) - Number(idName.test(a.name)))) {
    if (info.detected !== "id") continue;
    if (idTaken) info.detected = info.unique && info.samples.every((s) => parseNumber(s) !== "bad") ? "numeric" : "text";
    idTaken = true;
  }
  return infos.map(({ unique: _unique, ...rest }) => rest);
}
