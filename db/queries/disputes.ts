import "server-only";
import { type SQL, sql } from "drizzle-orm";
import { db } from "@/db";
import type { SuggestionSnapshot } from "@/db/schema";

export type DisputeFilter = { status: "open" | "ruled"; reason?: "disagreement" | "doubt"; classA?: number; classB?: number; minAgeHours?: number; maxAgeHours?: number };
export type DisputeLabel = { labelId: number; classId: number; annotatorId: string; annotatorName: string | null; tookSuggestion: boolean; suggestion: SuggestionSnapshot | null; createdAt: string };
export type DisputeRow = {
  id: number;
  itemId: number;
  externalId: string;
  reason: "disagreement" | "doubt";
  status: "open" | "ruled";
  note: string | null;
  openedAt: string;
  closedAt: string | null;
  itemStatus: string;
  finalClassId: number | null;
  finalSource: string | null;
  classIds: number[];
  labels: DisputeLabel[];
};

/** The classes a dispute is about: its live labels' classes plus, for doubts, the item's current final label. */
const involved = sql`(array(select distinct c from unnest(
  array(select l.class_id from labels l where l.item_id = i.id and l.undone_at is null) || array_remove(array[i.final_class_id], null)
) c order by c))`;

function where(projectId: number, f: DisputeFilter): SQL {
  const parts: SQL[] = [sql`d.project_id = ${projectId}`, sql`d.status = ${f.status}`];
  if (f.reason) parts.push(sql`d.reason = ${f.reason}`);
  if (f.classA != null) parts.push(sql`${f.classA} = any(${involved})`);
  if (f.classB != null) parts.push(sql`${f.classB} = any(${involved})`);
  if (f.minAgeHours != null) parts.push(sql`d.opened_at <= now() - make_interval(secs => ${f.minAgeHours * 3600})`);
  if (f.maxAgeHours != null) parts.push(sql`d.opened_at >= now() - make_interval(secs => ${f.maxAgeHours * 3600})`);
  return sql.join(parts, sql` and `);
}

const selectRow = sql`
  select d.id, d.item_id, i.external_id, d.reason, d.status, d.note, d.opened_at, d.closed_at,
    i.status as item_status, i.final_class_id, i.final_source, ${involved} as class_ids,
    coalesce((select json_agg(json_build_object('labelId', l.id, 'classId', l.class_id, 'annotatorId', l.annotator_id, 'annotatorName', u.name,
        'tookSuggestion', l.took_suggestion, 'suggestion', l.suggestion, 'createdAt', l.created_at) order by l.id)
      from labels l join users u on u.id = l.annotator_id where l.item_id = i.id and l.undone_at is null), '[]'::json) as labels
  from disputes d join items i on i.id = d.item_id`;

type Raw = { id: number; item_id: number; external_id: string; reason: "disagreement" | "doubt"; status: "open" | "ruled"; note: string | null; opened_at: Date; closed_at: Date | null; item_status: string; final_class_id: number | null; final_source: string | null; class_ids: number[]; labels: DisputeLabel[] };

const toRow = (r: Raw): DisputeRow => ({
  id: r.id,
  itemId: r.item_id,
  externalId: r.external_id,
  reason: r.reason,
  status: r.status,
  note: r.note,
  openedAt: new Date(r.opened_at).toISOString(),
  closedAt: r.closed_at ? new Date(r.closed_at).toISOString() : null,
  itemStatus: r.item_status,
  finalClassId: r.final_class_id,
  finalSource: r.final_source,
  classIds: r.class_ids.map(Number),
  labels: r.labels,
});

/** Oldest first; paged by (opened_at, id). */
export async function listDisputesByProjectId({ projectId, filter, after, limit }: { projectId: number; filter: DisputeFilter; after: { at: string; id: number } | null; limit: number }) {
  const page = after ? sql` and (d.opened_at, d.id) > (${after.at}::timestamptz, ${after.id})` : sql``;
  const res = await db.execute<Raw>(sql`${selectRow} where ${where(projectId, filter)}${page} order by d.opened_at asc, d.id asc limit ${limit}`);
  return res.rows.map(toRow);
}

export async function countDisputesByProjectId({ projectId, filter }: { projectId: number; filter: DisputeFilter }) {
  const res = await db.execute<{ n: number }>(sql`select count(*)::int as n from disputes d join items i on i.id = d.item_id where ${where(projectId, filter)}`);
  return res.rows[0]?.n ?? 0;
}

/** How many open disputes involve each pair of classes (for the class-pair filter). */
export async function listDisputePairsByProjectId({ projectId }: { projectId: number }) {
  const res = await db.execute<{ a: number; b: number; n: number }>(sql`
    with inv as (select d.id, ${involved} as cs from disputes d join items i on i.id = d.item_id where d.project_id = ${projectId} and d.status = 'open')
    select x.a, y.b, count(*)::int as n
    from inv, unnest(inv.cs) as x(a), unnest(inv.cs) as y(b)
    where x.a < y.b group by x.a, y.b order by n desc, x.a, y.b`);
  return res.rows.map((r) => ({ a: Number(r.a), b: Number(r.b), n: r.n }));
}

export async function getDisputeById({ projectId, disputeId }: { projectId: number; disputeId: number }) {
  const res = await db.execute<Raw>(sql`${selectRow} where d.project_id = ${projectId} and d.id = ${disputeId}`);
  return res.rows[0] ? toRow(res.rows[0]) : null;
}

/** Skips and unclear-flags annotators left on an item (comments help the reviewer). */
export async function listFlagsByItemId({ itemId }: { itemId: number }) {
  const res = await db.execute<{ kind: "skip" | "flag"; comment: string | null; name: string | null; created_at: Date }>(sql`
    select f.kind, f.comment, u.name, f.created_at from item_flags f join users u on u.id = f.user_id
    where f.item_id = ${itemId} order by f.id`);
  return res.rows.map((r) => ({ kind: r.kind, comment: r.comment, name: r.name, createdAt: new Date(r.created_at).toISOString() }));
}
