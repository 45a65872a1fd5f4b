// Krippendorff (2011), "Computing Krippendorff's Alpha-Reliability", nominal example: 4 observers × 12 units
// with missing values, α = 0.743. Classes "1"…"5" are the example's values.
import fs from "node:fs";
import path from "node:path";
import { makeUser } from "./fixtures";
import type { LabelSpec } from "./labels";

export const krippendorff2011Classes = ["1", "2", "3", "4", "5"];

/** The fixture's rating rows as [unit, observer, value], and its units in first-seen order. */
export function readKrippendorff2011(): { rows: string[][]; units: string[] } {
  const csv = fs.readFileSync(path.resolve(__dirname, "../fixtures/agreement/krippendorff-2011-nominal.csv"), "utf8");
  const rows = csv.trim().split("\n").slice(1).map((line) => line.split(","));
  return { rows, units: [...new Set(rows.map((r) => r[0]))] };
}

/**
 * The example's ratings as labels without a suggestion, by four new users "Observer A"…"Observer D";
 * `itemIds[i]` is the item of `units[i]`, `classes` hold one class per value, named as the value.
 */
export async function krippendorff2011Labels(
  example: { rows: string[][]; units: string[] },
  itemIds: number[],
  classes: Array<{ id: number; name: string }>,
): Promise<Array<Omit<LabelSpec, "undone" | "createdAt">>> {
  const observers = await Promise.all(["A", "B", "C", "D"].map((n) => makeUser({ name: `Observer ${n}` })));
  return example.rows.map(([unit, observer, value]) => ({
    item: itemIds[example.units.indexOf(unit)],
    annotator: observers["ABCD".indexOf(observer)].id,
    classId: classes.find((c) => c.name === value)!.id,
    suggestion: "none" as const,
    topClassId: null,
    took: false,
  }));
}
