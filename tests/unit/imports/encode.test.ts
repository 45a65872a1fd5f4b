import { describe, expect, it } from "vitest";
import { RowEncoder } from "@/lib/imports/encode";
import { describe as describeIssue, groupDigits, IssueLog } from "@/lib/imports/issues";
import { checkSchemaMatches, makePlan } from "@/lib/imports/plan";
import { ArrayRow, parseNumber } from "@/lib/imports/row-values";
import type { RoleMapping } from "@/lib/imports/types";

const header = ["id", "depth_m", "emb", "site", "note", "label"];
const mapping: RoleMapping = [
  { name: "id", role: "id" },
  { name: "depth_m", role: "numeric" },
  { name: "emb", role: "vector", width: 3 },
  { name: "site", role: "categorical" },
  { name: "note", role: "text" },
  { name: "label", role: "prior_label" },
];
const classes = new Map([["alpha", 11], ["beta", 12]]);

function encoder(missing: "reject" | "missing" = "reject") {
  return new RowEncoder(makePlan(header, mapping), { missing, classes, headerWidth: header.length, ragged: true });
}

describe("row encoding", () => {
  it("packs numeric and vector columns in header order", () => {
    const issues = new IssueLog();
    const item = encoder().encode({ row: 1, values: new ArrayRow(["a-1", "2.5", "[1, 2, 3]", "north", "hi", "beta"]) }, issues);
    expect(issues.count).toBe(0);
    expect(Array.from(item!.vector!)).toEqual([2.5, 1, 2, 3]);
    expect(item!.fields).toEqual({ site: "north", note: "hi" });
    expect(item!.priorClassId).toBe(12);
    expect(item!.externalId).toBe("a-1");
  });

  it("names the row and column of each problem", () => {
    const issues = new IssueLog();
    const e = encoder();
    e.encode({ row: 1043, values: new ArrayRow(["a-1", "n/a", "[1,2,3]", "x", "", ""]) }, issues);
    e.encode({ row: 1044, values: new ArrayRow(["a-2", "1", "[1,2]", "x", "", "zebra"]) }, issues);
    e.encode({ row: 1045, values: new ArrayRow(["a-1", "1", "[1,2,3]", "x", "", ""]) }, issues);
    e.encode({ row: 1046, values: new ArrayRow(["a-3", "1"]) }, issues);
    expect(issues.all.map(describeIssue)).toEqual([
      "row 1 043, column `depth_m`: 'n/a' is not a number",
      "row 1 044, column `emb`: the vector has 2 values; this column's vectors have 3",
      "row 1 044, column `label`: 'zebra' is not in the label set (alpha, beta)",
      "row 1 045, column `id`: the id 'a-1' also appears on row 1043",
      "row 1 046: the row has 2 values; the header has 6",
    ]);
  });

  it("rejects or keeps missing numbers per the project setting", () => {
    for (const raw of ["", "NaN", "Infinity", "-inf"]) {
      const rejected = new IssueLog();
      encoder("reject").encode({ row: 2, values: new ArrayRow(["a", raw, "[1,2,3]", "x", "", ""]) }, rejected);
      expect(rejected.count).toBe(1);
      expect(rejected.all[0].message).toMatch(/rejects missing values/);
      const kept = new IssueLog();
      const item = encoder("missing").encode({ row: 2, values: new ArrayRow(["a", raw, "[1,2,3]", "x", "", ""]) }, kept);
      expect(kept.count).toBe(0);
      expect(Number.isNaN(item!.vector![0])).toBe(true);
    }
  });

  it("parses numbers like Number() and flags float32 overflow", () => {
    expect(parseNumber(" 4.5 ")).toBe(4.5);
    expect(parseNumber("1e39")).toBe("huge");
    expect(parseNumber("abc")).toBe("bad");
    expect(parseNumber(null)).toBe("missing");
  });

  it("groups row numbers by thousands", () => {
    expect(groupDigits(1043)).toBe("1 043");
    expect(groupDigits(1234567)).toBe("1 234 567");
    expect(groupDigits(12)).toBe("12");
  });

  it("holds later imports to the first import's feature schema", () => {
    const first = makePlan(header, mapping).featureSchema;
    expect(first.dimension).toBe(4);
    expect(() => checkSchemaMatches(first, makePlan(header, mapping).featureSchema)).not.toThrow();
    const other = makePlan(header, mapping.map((m) => (m.name === "emb" ? { ...m, width: 4 } : m))).featureSchema;
    expect(() => checkSchemaMatches(first, other)).toThrow(/fixed by its first import/);
  });

  it("needs a feature and at most one id", () => {
    expect(() => makePlan(["a", "b"], [{ name: "a", role: "id" }, { name: "b", role: "text" }])).toThrow(/No column is a feature/);
    expect(() => makePlan(["a", "b", "c"], [{ name: "a", role: "id" }, { name: "b", role: "id" }, { name: "c", role: "numeric" }])).toThrow(/Only one column can be the id/);
  });
});
