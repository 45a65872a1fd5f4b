import type { FeatureColumn, FeatureSchema } from "@/lib/projects/settings";
import { ImportFailure } from "./issues";
import { limits } from "./limits";
import type { ColumnRole, RoleMapping } from "./types";

export type PlannedColumn = { index: number; name: string; role: ColumnRole; width: number; offset: number };

/** How source columns become an item: which column is the id, where each number goes in the vector. */
export type Plan = {
  columns: PlannedColumn[];
  id: PlannedColumn | null;
  numeric: PlannedColumn[];
  vectors: PlannedColumn[];
  categorical: PlannedColumn[];
  text: PlannedColumn[];
  prior: PlannedColumn | null;
  dimension: number;
  featureSchema: FeatureSchema;
};

/** Builds the plan from the source header and the owner's confirmed roles (in header order). */
export function makePlan(header: string[], mapping: RoleMapping, source: FeatureSchema["source"] = "table"): Plan {
  const byName = new Map(mapping.map((m) => [m.name, m]));
  for (const m of mapping) {
    if (!header.includes(m.name) && m.role !== "ignore") throw new ImportFailure(`The column \`${m.name}\` is in the role mapping but not in the file.`, m.name);
  }
  let offset = 0;
  const columns: PlannedColumn[] = header.map((name, index) => {
    const m = byName.get(name);
    const role: ColumnRole = m?.role ?? "ignore";
    let width = 0;
    if (role === "numeric") width = 1;
    if (role === "vector") {
      if (!m?.width) throw new ImportFailure(`The vector column \`${name}\` needs a length.`, name);
      if (m.width > limits.maxVectorWidth) throw new ImportFailure(`The vector column \`${name}\` is ${m.width} long; the limit is ${limits.maxVectorWidth}.`, name);
      width = m.width;
    }
    const col = { index, name, role, width, offset };
    offset += width;
    return col;
  });
  const of = (r: ColumnRole) => columns.filter((c) => c.role === r);
  const ids = of("id");
  const priors = of("prior_label");
  if (ids.length > 1) throw new ImportFailure(`Only one column can be the id; ${ids.map((c) => `\`${c.name}\``).join(" and ")} both are.`);
  if (priors.length > 1) throw new ImportFailure(`Only one column can be the prior label; ${priors.map((c) => `\`${c.name}\``).join(" and ")} both are.`);
  const featureCols: FeatureColumn[] = columns
    .filter((c) => c.role === "numeric" || c.role === "vector" || c.role === "categorical")
    .map((c) => ({ name: c.name, kind: c.role as FeatureColumn["kind"], width: c.width }));
  if (featureCols.length === 0) throw new ImportFailure("No column is a feature: mark at least one column numeric, vector or categorical.");
  return {
    columns,
    id: ids[0] ?? null,
    numeric: of("numeric"),
    vectors: of("vector"),
    categorical: of("categorical"),
    text: of("text"),
    prior: priors[0] ?? null,
    dimension: offset,
    featureSchema: { columns: featureCols, dimension: offset, source },
  };
}

/** Later imports must bring the same feature columns (names, kinds, widths, order) as the project's first one. */
export function checkSchemaMatches(existing: FeatureSchema | null, incoming: FeatureSchema) {
  if (!existing) return;
  const a = existing.columns;
  const b = incoming.columns;
  const names = (cols: FeatureColumn[]) => cols.map((c) => `${c.name} (${c.kind}${c.kind === "vector" ? ` ×${c.width}` : ""})`).join(", ");
  const same = a.length === b.length && a.every((c, i) => c.name === b[i].name && c.kind === b[i].kind && c.width === b[i].width);
  if (!same) {
    throw new ImportFailure(`This project's feature schema is fixed by its first import: ${names(a)}. This file brings ${names(b)}. Rename or re-map the columns to match.`);
  }
}
