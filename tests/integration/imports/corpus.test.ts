// The malformed-file corpus: every case fails with a message a person can act on, and stores zero items.
import { describe, expect, it } from "vitest";
import { makeProject } from "@/tests/support/fixtures";
import { describe as describeIssue } from "@/lib/imports/describe";
import { getObjectBytes } from "@/lib/storage/s3";
import { importFixtures, itemCount } from "./helpers";
import type { RoleMapping } from "@/lib/imports/types";

const idDepth: RoleMapping = [{ name: "id", role: "id" }, { name: "depth_m", role: "numeric" }];
const samples: RoleMapping = [
  { name: "sample_id", role: "id" },
  { name: "depth_m", role: "numeric" },
  { name: "salinity", role: "numeric" },
  { name: "site", role: "categorical" },
  { name: "note", role: "text" },
  { name: "label", role: "prior_label" },
];

type Case = { file: string; expect: RegExp; format?: "csv" | "jsonl" | "images"; columns?: RoleMapping };
const cases: Case[] = [
  { file: "empty.csv", columns: idDepth, expect: /is empty \(0 bytes\)/ },
  { file: "header-only.csv", columns: samples, expect: /header but no rows/ },
  { file: "ragged.csv", columns: samples, expect: /^row 2: the row has 4 values; the header has 6$/ },
  { file: "vector-wrong-length.csv", columns: [{ name: "id", role: "id" }, { name: "embedding", role: "vector", width: 3 }], expect: /^row 3, column `embedding`: the vector has 2 values; this column's vectors have 3$/ },
  { file: "nan-infinity-empty.csv", columns: [...idDepth, { name: "salinity", role: "numeric" }], expect: /^row 2, column `depth_m`: 'NaN' is a missing value, and this project rejects missing values/ },
  { file: "not-a-number.csv", columns: [...idDepth, { name: "salinity", role: "numeric" }], expect: /^row 1 043, column `depth_m`: 'n\/a' is not a number$/ },
  { file: "duplicate-ids.csv", columns: idDepth, expect: /^row 3, column `id`: the id 'd-1' also appears on row 1$/ },
  { file: "unknown-label.csv", columns: [...idDepth, { name: "label", role: "prior_label" }], expect: /^row 2, column `label`: 'zebra' is not in the label set \(alpha, beta, gamma\)$/ },
  { file: "latin1.csv", columns: [...idDepth, { name: "site", role: "text" }], expect: /not valid UTF-8 \(the first bad byte, 0xfc, is at byte 23/ },
  { file: "utf16.csv", columns: idDepth, expect: /encoded as UTF-16/ },
  { file: "too-many-columns.csv", columns: idDepth, expect: /has 2101 columns; the limit is 2048/ },
  { file: "bad-json.jsonl", format: "jsonl", columns: idDepth, expect: /^row 2: the line is not valid JSON/ },
  { file: "not-an-image.png", format: "images", expect: /^row 1: `not-an-image\.png` is not an image Vicinal can read/ },
  { file: "traversal.zip", format: "images", expect: /unsafe path \(`\.\.\/\.\.\/etc\/evil\.png`\)/ },
  { file: "bomb.zip", format: "images", expect: /decompression bomb/ },
];

describe("malformed files store zero items", () => {
  for (const c of cases) {
    it(c.file, async () => {
      const { project } = await makeProject();
      const imp = await importFixtures(project.id, [`malformed/${c.file}`], { format: c.format ?? "csv", columns: c.columns ?? [] });
      expect(imp.status).toBe("failed");
      expect(imp.errorCount).toBeGreaterThan(0);
      expect(imp.errors.map(describeIssue).some((m) => c.expect.test(m))).toBe(true);
      expect(imp.itemsCreated).toBe(0);
      expect(await itemCount(project.id)).toBe(0);
    });
  }

  it("lists every NaN, Infinity and empty cell, and writes the full list as CSV to the bucket", async () => {
    const { project } = await makeProject();
    const imp = await importFixtures(project.id, ["malformed/nan-infinity-empty.csv"], { format: "csv", columns: [...idDepth, { name: "salinity", role: "numeric" }] });
    expect(imp.errors.map(describeIssue)).toEqual([
      "row 2, column `depth_m`: 'NaN' is a missing value, and this project rejects missing values (Settings → missing values)",
      "row 3, column `depth_m`: 'Infinity' is a missing value, and this project rejects missing values (Settings → missing values)",
      "row 4, column `depth_m`: the value is empty, and this project rejects missing values (Settings → missing values)",
    ]);
    const csv = Buffer.from(await getObjectBytes(imp.errorReportKey!)).toString("utf8");
    expect(csv.split("\n")[0]).toBe("row,column,message,description");
    expect(csv).toContain("4,depth_m,\"the value is empty, and this project rejects missing values (Settings → missing values)\"");
  });

  it("keeps NaN, Infinity and empty as missing when the project says so", async () => {
    const { project } = await makeProject({ settings: { missingValues: "missing" } });
    const imp = await importFixtures(project.id, ["malformed/nan-infinity-empty.csv"], { format: "csv", columns: [...idDepth, { name: "salinity", role: "numeric" }] });
    expect(imp.status).toBe("succeeded");
    expect(await itemCount(project.id)).toBe(4);
  });
});
