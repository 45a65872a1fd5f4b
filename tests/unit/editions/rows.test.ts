// Row building: features from fields and the packed vector, annotators' labels and shown vote shares, and the same row in CSV, JSONL and Parquet.
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { parquetReadObjects } from "hyparquet";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { csvHeader, planFeatureColumns } from "@/lib/editions/columns";
import { shortestFloat32 } from "@/lib/editions/float";
import { ParquetSink } from "@/lib/editions/parquet";
import { type SourceItem, buildRow, csvRow, jsonlRow } from "@/lib/editions/rows";
import type { FeatureSchema } from "@/lib/projects/settings";
import { packFloat32 } from "@/lib/random";

const schema: FeatureSchema = {
  source: "table",
  dimension: 4,
  columns: [
    { name: "length", kind: "numeric", width: 1 },
    { name: "colour", kind: "categorical", width: 0 },
    { name: "emb", kind: "vector", width: 3 },
  ],
};
const classNames = new Map([[11, "cat"], [12, "dog"]]);
const shown = (shares: Record<string, number>) => ({ shown: true, topClassId: 11, shares, k: 5, distance: "euclidean", engineVersion: "t", knnVersion: 3 });

const item: SourceItem = {
  id: 5,
  externalId: "=cmd|' /C calc'!A0",
  fields: { colour: "-red", note: { a: 1 } },
  vector: packFloat32([2.35, 0.1, -1.5, Number.NaN]),
  isBlind: false,
  isControl: false,
  classId: 11,
  source: "agreed",
  labels: [
    { annotatorId: "u-1", email: "ana@example.test", classId: 11, suggestion: shown({ "11": 0.8, "12": 0.2 }) },
    { annotatorId: "u-2", email: "ben@example.test", classId: 11, suggestion: { ...shown({ "11": 0.6, "12": 0.4 }), shown: false } },
  ],
};

const features = planFeatureColumns({ schema, fieldKeys: ["colour", "note"], hasVector: true });

describe("planFeatureColumns", () => {
  it("takes the schema's columns in order with their vector offsets, then other fields; a bare vector without a schema", () => {
    expect(features).toEqual([
      { name: "length", kind: "numeric", offset: 0 },
      { name: "colour", kind: "categorical" },
      { name: "emb", kind: "vector", offset: 1, width: 3 },
      { name: "note", kind: "field" },
    ]);
    expect(planFeatureColumns({ schema: null, fieldKeys: ["b", "a"], hasVector: true })).toEqual([
      { name: "vector", kind: "vector", offset: 0, width: null },
      { name: "a", kind: "field" },
      { name: "b", kind: "field" },
    ]);
  });
});

describe("shortestFloat32", () => {
  it("gives the shortest decimal that reads back as the same float32", () => {
    expect(shortestFloat32(Math.fround(2.35))).toBe(2.35);
    expect(shortestFloat32(Math.fround(0.1))).toBe(0.1);
    const third = shortestFloat32(Math.fround(1 / 3)) as number;
    expect(Math.fround(third)).toBe(Math.fround(1 / 3));
    expect(String(third).length).toBeLessThan(String(Math.fround(1 / 3)).length);
    expect(shortestFloat32(Number.NaN)).toBeNull();
  });
});

describe("buildRow", () => {
  it("names annotators by id by default and keeps only the vote shares that were on screen", () => {
    const row = buildRow(item, "train", { classNames, features, identity: "id" });
    expect(row).toMatchObject({ external_id: item.externalId, split: "train", final_label: "cat", label_source: "agreed", is_blind: false, is_control: false });
    expect(row.features).toEqual({ length: 2.35, colour: "-red", emb: [0.1, -1.5, null], note: { a: 1 } });
    expect(row.labels).toEqual({ "u-1": "cat", "u-2": "cat" });
    expect(row.vote_shares).toEqual({ "u-1": { cat: 0.8, dog: 0.2 } });
    expect(JSON.stringify(row)).not.toContain("ana@example.test");
  });

  it("uses e-mail addresses when the owner chose them", () => {
    const row = buildRow(item, null, { classNames, features, identity: "email" });
    expect(Object.keys(row.labels)).toEqual(["ana@example.test", "ben@example.test"]);
  });
});

describe("one row in three formats", () => {
  const row = buildRow(item, "test", { classNames, features, identity: "id" });
  const annotators = ["u-1", "u-2"];

  it("CSV: neutralised text cells, plain numbers, JSON for vectors and shares", () => {
    const text = csvRow(row, features, annotators);
    const [header, cells] = Papa.parse<string[]>(csvHeader(features, annotators).join(",") + "\r\n" + text.trimEnd(), { newline: "\r\n" }).data;
    const rec = Object.fromEntries(header.map((h, i) => [h, cells[i]]));
    expect(rec.external_id).toBe(`'${item.externalId}`);
    expect(rec["feature:length"]).toBe("2.35");
    expect(rec["feature:colour"]).toBe("'-red");
    expect(JSON.parse(rec["feature:emb"])).toEqual([0.1, -1.5, null]);
    expect(rec["label:u-1"]).toBe("cat");
    expect(JSON.parse(rec.vote_shares)).toEqual({ "u-1": { cat: 0.8, dog: 0.2 } });
    expect(rec.split).toBe("test");
  });

  it("JSON Lines: the row object verbatim", () => {
    expect(JSON.parse(jsonlRow(row))).toEqual(JSON.parse(JSON.stringify(row)));
  });

  it("Parquet: hyparquet reads back the same values, over several row groups", async () => {
    const file = path.join(mkdtempSync(path.join(tmpdir(), "edition-unit-")), "t.parquet");
    const sink = new ParquetSink(file, features, annotators, 2);
    for (let i = 0; i < 5; i += 1) sink.add({ ...row, external_id: `id-${i}` });
    sink.close();
    const bytes = readFileSync(file);
    const rows = (await parquetReadObjects({ file: bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) })) as Array<Record<string, unknown>>;
    expect(rows.map((r) => r.external_id)).toEqual(["id-0", "id-1", "id-2", "id-3", "id-4"]);
    expect(rows[3]).toMatchObject({ split: "test", final_label: "cat", label_source: "agreed", "feature:length": 2.35, "feature:colour": "-red", "label:u-1": "cat", is_blind: false });
    expect((rows[3]["feature:emb"] as number[]).map((x) => (x === null ? null : Math.fround(x)))).toEqual([Math.fround(0.1), -1.5, null]);
    expect(rows[3].vote_shares).toEqual({ "u-1": { cat: 0.8, dog: 0.2 } });
  });
});
