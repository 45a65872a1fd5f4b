import { pool } from "@/db";
import type { ProjectSettings } from "@/lib/projects/settings";
import { voterFlags } from "./engine-settings";

/** One item as the engine reads it: raw vector, categorical fields, and the class it votes with (null = does not vote). */
export type VotingRow = {
  id: number;
  vector: Buffer | null;
  fields: Record<string, unknown>;
  status: string;
  finalClassId: number | null;
  voteClassId: number | null;
};

type Scope = { kind: "voters" } | { kind: "all" } | { kind: "ids"; ids: number[] };

/**
 * The items whose vote changed after version `after` up to and including `upTo`, from the change log; null when the log
 * cannot account for every version in between (pruned, or written before the log existed): the caller rebuilds.
 */
export async function queryChangedItemIds(projectId: number, after: number, upTo: number): Promise<number[] | null> {
  if (upTo <= after) return [];
  const res = await pool.query(
    `select coalesce(array_agg(distinct item_id), '{}') as ids, count(distinct version)::int as versions
     from knn_changes where project_id = $1 and version > $2 and version <= $3`,
    [projectId, after, upTo],
  );
  const row = res.rows[0] as { ids: number[]; versions: number };
  return row.versions === upTo - after ? row.ids : null;
}

/*
 * The class an item votes with, by the fixed precedence (each source only when enabled in settings.voters):
 *   ruling  — the latest ruling on any of the item's disputes (else final_class_id when final_source = 'ruling');
 *   agreed  — final_class_id when final_source = 'agreed';
 *   single  — the class when the item's live labels (not undone) all name one class, else final_class_id when final_source = 'single';
 *   control — known_class_id of a control item.
 * Per-item subqueries on indexed columns keep the cost linear whatever the planner's row estimates.
 */
export async function queryVotingRows(projectId: number, settings: Pick<ProjectSettings, "voters">, scope: Scope, fieldNames: readonly string[] = []): Promise<VotingRow[]> {
  const f = voterFlags(settings);
  const params: unknown[] = [projectId, f.ruling, f.agreed, f.single, f.control];
  let filter = "";
  if (scope.kind === "ids") {
    params.push(scope.ids);
    filter = `and i.id = any($${params.length}::int[])`;
  }
  // Only the categorical fields the features need travel (fields can hold long texts).
  let fieldsSql = "'{}'::jsonb";
  if (fieldNames.length) {
    params.push(fieldNames);
    fieldsSql = `(select coalesce(jsonb_object_agg(n, i.fields->n), '{}'::jsonb) from unnest($${params.length}::text[]) n)`;
  }
  const text = `
    select * from (
      select i.id, i.vector, ${fieldsSql} as fields, i.status::text as status, i.final_class_id,
        coalesce(
          case when $2 then coalesce(
            (select r.class_id from disputes d join rulings r on r.dispute_id = d.id where d.item_id = i.id order by r.created_at desc, r.id desc limit 1),
            case when i.final_source = 'ruling' then i.final_class_id end) end,
          case when $3 and i.final_source = 'agreed' then i.final_class_id end,
          case when $4 then coalesce(
            (select case when count(distinct l.class_id) = 1 then min(l.class_id) end from labels l where l.item_id = i.id and l.undone_at is null),
            case when i.final_source = 'single' then i.final_class_id end) end,
          case when $5 and i.is_control then i.known_class_id end
        ) as vote_class_id
      from items i
      where i.project_id = $1 ${filter}
    ) x ${scope.kind === "voters" ? "where x.vote_class_id is not null" : ""}
    order by x.id`;
  const res = await pool.query(text, params);
  return res.rows.map((r) => ({
    id: r.id as number,
    vector: (r.vector as Buffer | null) ?? null,
    fields: (r.fields as Record<string, unknown>) ?? {},
    status: r.status as string,
    finalClassId: (r.final_class_id as number | null) ?? null,
    voteClassId: (r.vote_class_id as number | null) ?? null,
  }));
}
