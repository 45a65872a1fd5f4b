import { createHash } from "node:crypto";
import { IssueLog, say } from "./issues";
import { limits } from "./limits";
import type { Plan, PlannedColumn } from "./plan";
import { parseNumber, type Parsed, type RowValues } from "./row-values";
import type { SourceRow, StagedItem } from "./types";

export type MissingPolicy = "reject" | "missing";
const MAX_CATEGORIES = 1_000;

/** PostgreSQL text and jsonb cannot hold U+0000; such a cell is refused with its row and column. */
function hasNul(value: unknown): boolean {
  if (typeof value === "string") return value.includes("\u0000");
  if (value !== null && typeof value === "object") return (JSON.stringify(value) ?? "").includes("\\u0000");
  return false;
}

const nulMessage = "contains a NUL character (byte 0), which cannot be stored; remove it from the file";

function shown(value: unknown): string {
  if (typeof value === "string") return value;
  try {
    return JSON.stringify(value) ?? String(value);
  } catch {
    return String(value);
  }
}

function vectorParts(value: unknown): unknown[] | null {
  if (Array.isArray(value)) return value;
  if (typeof value === "string") {
    const t = value.trim();
    if (t === "") return null;
    const inner = t.startsWith("[") && t.endsWith("]") ? t.slice(1, -1) : t;
    return inner.trim() === "" ? [] : inner.split(/[\s,;]+/).filter((p) => p.length > 0);
  }
  return null;
}

export { parseNumber };

/** Turns source rows into staged items, reporting each problem against its row and column. */
export class RowEncoder {
  private readonly scratch: Float32Array;
  private readonly seen = new Map<string, number>();
  readonly categories: Map<string, Set<string>>;
  private readonly width: number;

  constructor(
    private readonly plan: Plan,
    private readonly opts: { missing: MissingPolicy; classes: Map<string, number>; headerWidth: number; ragged: boolean },
  ) {
    this.scratch = new Float32Array(plan.dimension);
    this.width = opts.headerWidth;
    this.categories = new Map(plan.categorical.map((c) => [c.name, new Set<string>()]));
  }

  /** Returns the item (its vector is reused by the next call) or null when the row has problems. */
  encode(src: SourceRow, issues: IssueLog): StagedItem | null {
    const { row, values } = src;
    if (src.error !== undefined) {
      issues.add({ row, column: null, message: `the line is not valid JSON (${src.error})` });
      return null;
    }
    if (this.opts.ragged && values.length !== this.width) {
      issues.add({ row, column: null, message: `the row has ${values.length} value${values.length === 1 ? "" : "s"}; the header has ${this.width}` });
      return null;
    }
    const before = issues.count;
    const vec = this.scratch;
    for (const c of this.plan.numeric) this.numberInto(vec, c.offset, values, row, c, issues);
    for (const c of this.plan.vectors) this.vectorInto(vec, c, values.raw(c.index), row, issues);
    const fields: Record<string, unknown> = {};
    for (const c of this.plan.categorical) {
      const v = values.raw(c.index);
      const s = v === null || v === undefined ? "" : String(v).trim();
      if (hasNul(s)) issues.add({ row, column: c.name, message: nulMessage });
      if (s === "" && this.opts.missing === "reject") issues.add({ row, column: c.name, message: say.missingRejected("") });
      fields[c.name] = s === "" ? null : s;
      const set = this.categories.get(c.name);
      if (s && set && set.size < MAX_CATEGORIES) set.add(s);
    }
    for (const c of this.plan.text) {
      const v = values.raw(c.index);
      if (hasNul(v)) issues.add({ row, column: c.name, message: nulMessage });
      fields[c.name] = v === undefined ? null : v;
    }
    const externalId = this.idOf(values, row, issues);
    if (externalId !== null && hasNul(externalId)) issues.add({ row, column: this.plan.id?.name ?? "id", message: nulMessage });
    let priorClassId: number | null = null;
    if (this.plan.prior) {
      const v = values.raw(this.plan.prior.index);
      const s = v === null || v === undefined ? "" : String(v).trim();
      if (s !== "") {
        const id = this.opts.classes.get(s);
        if (id === undefined) {
          const names = [...this.opts.classes.keys()];
          issues.add({ row, column: this.plan.prior.name, message: `${say.quote(s)} is not in the label set (${names.slice(0, 12).join(", ")}${names.length > 12 ? ", …" : ""})` });
        } else priorClassId = id;
      }
    }
    if (issues.count > before || externalId === null) return null;
    return { row, externalId, fields, vector: this.plan.dimension > 0 ? vec : null, priorClassId };
  }

  private numberInto(vec: Float32Array, at: number, values: RowValues, row: number, c: PlannedColumn, issues: IssueLog) {
    const p: Parsed = values.num(c.index);
    if (typeof p === "number") {
      vec[at] = p;
      return;
    }
    vec[at] = Number.NaN;
    const value = values.raw(c.index);
    if (p === "missing") {
      if (this.opts.missing === "reject") issues.add({ row, column: c.name, message: say.missingRejected(value == null ? "" : shown(value)) });
    } else if (p === "huge") issues.add({ row, column: c.name, message: say.tooBigForFloat(shown(value)) });
    else issues.add({ row, column: c.name, message: say.notNumber(shown(value)) });
  }

  private vectorInto(vec: Float32Array, c: PlannedColumn, value: unknown, row: number, issues: IssueLog) {
    const parts = vectorParts(value);
    if (parts === null) {
      if (value === null || value === undefined || value === "") {
        if (this.opts.missing === "reject") issues.add({ row, column: c.name, message: say.missingRejected("") });
        vec.fill(Number.NaN, c.offset, c.offset + c.width);
      } else issues.add({ row, column: c.name, message: `${say.quote(shown(value))} is not a vector (expected ${c.width} numbers, e.g. [0.1, 0.2, …])` });
      return;
    }
    if (parts.length !== c.width) {
      issues.add({ row, column: c.name, message: `the vector has ${parts.length} value${parts.length === 1 ? "" : "s"}; this column's vectors have ${c.width}` });
      return;
    }
    for (let k = 0; k < parts.length; k += 1) {
      const p = parseNumber(parts[k]);
      if (typeof p === "number") vec[c.offset + k] = p;
      else {
        vec[c.offset + k] = Number.NaN;
        if (p === "bad") {
          issues.add({ row, column: c.name, message: `element ${k + 1}: ${say.notNumber(shown(parts[k]))}` });
          return;
        }
        if (p === "huge") {
          issues.add({ row, column: c.name, message: `element ${k + 1}: ${say.tooBigForFloat(shown(parts[k]))}` });
          return;
        }
        if (this.opts.missing === "reject") {
          issues.add({ row, column: c.name, message: `element ${k + 1}: ${say.missingRejected(shown(parts[k]))}` });
          return;
        }
      }
    }
  }

  private idOf(values: RowValues, row: number, issues: IssueLog): string | null {
    let id: string;
    const col = this.plan.id;
    if (col) {
      const v = values.raw(col.index);
      id = v === null || v === undefined ? "" : String(v).trim();
      if (id === "") {
        issues.add({ row, column: col.name, message: "the id is empty" });
        return null;
      }
      if (id.length > limits.maxIdLength) {
        issues.add({ row, column: col.name, message: `the id is ${id.length} characters long; the limit is ${limits.maxIdLength}` });
        return null;
      }
    } else {
      // No id column: the row's content is its identity, so re-importing the same file adds nothing.
      id = `row-${createHash("sha1").update(Array.from({ length: values.length }, (_, i) => shown(values.raw(i))).join("\u0001")).digest("base64url").slice(0, 20)}`;
    }
    const first = this.seen.get(id);
    if (first !== undefined) {
      issues.add({ row, column: col?.name ?? null, message: col ? `the id ${say.quote(id)} also appears on row ${first}` : `the row repeats row ${first} exactly` });
      return null;
    }
    this.seen.set(id, row);
    return id;
  }
}
