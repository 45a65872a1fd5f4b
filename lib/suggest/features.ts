import { pool } from "@/db";
import { fitPreprocessor, preprocessStateSchema, transformTable, type PreprocessState, type TableInput } from "@/lib/knn";
import type { FeatureSchema, ProjectSettings } from "@/lib/projects/settings";
import { engineSettingsHash } from "./engine-settings";

/** Above this many items the preprocessing is fitted on a sample (ordered by items.random_key). */
export const PREPROCESS_FIT_MAX = 200_000;

type RawRow = { vector: Buffer | null; fields: Record<string, unknown> };

export function categoricalColumns(schema: FeatureSchema | null): string[] {
  return (schema?.columns ?? []).filter((c) => c.kind === "categorical").map((c) => c.name);
}

/** True when the row can be placed in feature space (its packed vector has the schema's dimension). */
export function hasFeatures(schema: FeatureSchema | null, row: RawRow): boolean {
  const dim = schema?.dimension ?? 0;
  if (dim === 0) return categoricalColumns(schema).length > 0;
  return row.vector !== null && row.vector.byteLength === dim * 4;
}

/** Raw rows → the engine's TableInput: `items.vector` slots are the numeric part (NaN = missing), categorical values come from `fields`. */
export function toTable(schema: FeatureSchema | null, rows: readonly RawRow[]): TableInput {
  const dim = schema?.dimension ?? 0;
  const numeric = new Float32Array(rows.length * dim);
  const bytes = new Uint8Array(numeric.buffer);
  rows.forEach((r, i) => {
    if (dim > 0 && r.vector) bytes.set(r.vector.subarray(0, dim * 4), i * dim * 4);
  });
  const categorical = categoricalColumns(schema).map((name) =>
    rows.map((r) => {
      const v = r.fields[name];
      return v === null || v === undefined || v === "" ? null : String(v);
    }),
  );
  return { n: rows.length, numeric, numericWidth: dim, categorical };
}

/** What knn_state.preprocessor holds: the fitted state and what it was fitted on. */
export type StoredPreprocessor = { scaling: string; maxSeq: number; dimension: number; fittedOn: number; sampled: boolean; state: PreprocessState };

function readStored(value: unknown): StoredPreprocessor | null {
  if (!value || typeof value !== "object") return null;
  const v = value as Partial<StoredPreprocessor>;
  const parsed = preprocessStateSchema.safeParse(v.state);
  if (!parsed.success || typeof v.maxSeq !== "number" || typeof v.scaling !== "string") return null;
  return { scaling: v.scaling, maxSeq: v.maxSeq, dimension: v.dimension ?? 0, fittedOn: v.fittedOn ?? 0, sampled: v.sampled ?? false, state: parsed.data };
}

/**
 * The project's fitted preprocessing, shared by every process through knn_state.preprocessor:
 * reused while the scaling, the engine settings hash and the newest item (max seq) are unchanged;
 * otherwise refitted on all the project's item vectors (a seeded-order sample of PREPROCESS_FIT_MAX
 * rows above that size) and stored with the new settings hash.
 */
export async function ensurePreprocessor(projectId: number, settings: ProjectSettings, schema: FeatureSchema | null, maxSeq: number): Promise<StoredPreprocessor> {
  const hash = engineSettingsHash(settings);
  const cur = await pool.query("select preprocessor, settings_hash from knn_state where project_id = $1", [projectId]);
  const stored = readStored(cur.rows[0]?.preprocessor);
  const dim = schema?.dimension ?? 0;
  if (stored && cur.rows[0].settings_hash === hash && stored.scaling === settings.scaling && stored.maxSeq === maxSeq && stored.dimension === dim) {
    return stored;
  }
  const count = Number((await pool.query("select count(*) from items where project_id = $1", [projectId])).rows[0].count);
  const sampled = count > PREPROCESS_FIT_MAX;
  const res = await pool.query(
    `select vector, (select coalesce(jsonb_object_agg(n, fields->n), '{}'::jsonb) from unnest($3::text[]) n) as fields
     from items where project_id = $1 order by ${sampled ? "random_key, id" : "id"} limit $2`,
    [projectId, PREPROCESS_FIT_MAX, categoricalColumns(schema)],
  );
  const rows = (res.rows as RawRow[]).filter((r) => hasFeatures(schema, r));
  const state = fitPreprocessor(toTable(schema, rows), settings.scaling);
  const next: StoredPreprocessor = { scaling: settings.scaling, maxSeq, dimension: dim, fittedOn: rows.length, sampled, state };
  await pool.query("update knn_state set preprocessor = $2, settings_hash = $3, updated_at = now() where project_id = $1", [projectId, JSON.stringify(next), hash]);
  return next;
}

/** Transforms raw rows (all must have features) into packed preprocessed rows of width state.width. */
export function transformRows(schema: FeatureSchema | null, state: PreprocessState, rows: readonly RawRow[]): Float32Array {
  return transformTable(state, toTable(schema, rows));
}
