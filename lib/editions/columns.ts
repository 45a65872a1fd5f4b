import type { FeatureSchema } from "@/lib/projects/settings";

/**
 * One feature column of an edition. Numeric and vector columns live in the packed `items.vector`
 * (at `offset`, `width` slots, in feature-schema order); categorical columns and any other field in `items.fields`.
 */
export type FeatureColumnPlan =
  | { name: string; kind: "numeric"; offset: number }
  | { name: string; kind: "vector"; offset: number; width: number | null }
  | { name: string; kind: "categorical" }
  | { name: string; kind: "field" };

/**
 * The feature columns of an edition: the schema's columns in order, then every other field key found on the
 * exported items (sorted). Without a schema, a packed vector is exported whole as "vector".
 */
export function planFeatureColumns({ schema, fieldKeys, hasVector }: { schema: FeatureSchema | null; fieldKeys: string[]; hasVector: boolean }): FeatureColumnPlan[] {
  const out: FeatureColumnPlan[] = [];
  const taken = new Set<string>();
  let offset = 0;
  for (const c of schema?.columns ?? []) {
    if (c.kind === "numeric") out.push({ name: c.name, kind: "numeric", offset });
    else if (c.kind === "vector") out.push({ name: c.name, kind: "vector", offset, width: c.width });
    else out.push({ name: c.name, kind: "categorical" });
    taken.add(c.name);
    offset += c.width;
  }
  if (!schema && hasVector && !fieldKeys.includes("vector")) {
    out.push({ name: "vector", kind: "vector", offset: 0, width: null });
    taken.add("vector");
  }
  for (const key of [...fieldKeys].sort()) if (!taken.has(key)) out.push({ name: key, kind: "field" });
  return out;
}

export const featureHeader = (c: FeatureColumnPlan) => `feature:${c.name}`;
export const labelHeader = (annotator: string) => `label:${annotator}`;

/** The fixed leading columns of every edition file. */
export const leadingColumns = ["external_id", "split", "final_label", "label_source", "is_blind", "is_control"] as const;
export const VOTE_SHARES = "vote_shares";

export function csvHeader(features: FeatureColumnPlan[], annotators: string[]): string[] {
  return [...leadingColumns, ...features.map(featureHeader), ...annotators.map(labelHeader), VOTE_SHARES];
}
