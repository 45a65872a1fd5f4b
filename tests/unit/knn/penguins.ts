import { readFileSync } from "node:fs";
import { join } from "node:path";

/** Palmer penguins (Horst, Hill & Gorman 2020, CC0) as shipped in vega-datasets 3.2.1. */
export const penguinFeatures = ["Beak Length (mm)", "Beak Depth (mm)", "Flipper Length (mm)", "Body Mass (g)"] as const;

export function loadPenguins() {
  const file = join(process.cwd(), "node_modules/vega-datasets/data/penguins.json");
  const rows = JSON.parse(readFileSync(file, "utf8")) as Record<string, string | number | null>[];
  const complete = rows.filter((r) => penguinFeatures.every((f) => typeof r[f] === "number"));
  const species = [...new Set(complete.map((r) => String(r.Species)))].sort();
  const numeric = new Float32Array(complete.length * 4);
  complete.forEach((r, i) => penguinFeatures.forEach((f, j) => (numeric[i * 4 + j] = r[f] as number)));
  const classes = Int32Array.from(complete, (r) => species.indexOf(String(r.Species)));
  return { rows, complete, species, numeric, classes, n: complete.length };
}
