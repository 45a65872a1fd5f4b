// No "server-only" here: the worker (plain Node) runs this module too.
import { sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";

/**
 * Everything the agreement computation needs, read by one statement so it is one snapshot:
 * the knn_state version and the live labels it covers cannot disagree.
 *
 * `labelText` holds one record per live label (ordered by item, then annotator), "item annotator class flags top" separated by ";",
 * with dense 0-based indices (classes by label_classes.position, annotators by user id in byte order, items by id);
 * flags: 1 = took the suggestion, 2 = the suggestion was on screen, 4 = a suggestion snapshot was stored.
 * `itemText` holds "item blind known final" per labelled item (-1 for none; known only on control items).
 */
export type AgreementRowsRaw = {
  version: number;
  labels: number;
  labelText: string;
  itemText: string;
  annotatorIds: string[];
  classIds: number[];
};

export async function getAgreementRowsByProjectId({ projectId, tx = db }: { projectId: number; tx?: DbOrTx }): Promise<AgreementRowsRaw> {
  const res = await tx.execute<{ version: string; labels: number; label_text: string; item_text: string; annotator_ids: string[] | null; class_ids: number[] | null }>(sql`
    with cls as (
      select id, (row_number() over (order by position, id) - 1)::int as idx from label_classes where project_id = ${projectId}
    ),
    lab as (
      select l.item_id, l.annotator_id, l.class_id, l.took_suggestion,
        coalesce(l.suggestion->>'shown' = 'true', false) as shown,
        l.suggestion is not null and jsonb_typeof(l.suggestion) = 'object' as has_snapshot,
        case when jsonb_typeof(l.suggestion->'topClassId') = 'number' then (l.suggestion->>'topClassId')::int end as top
      from labels l where l.project_id = ${projectId} and l.undone_at is null
    ),
    ann as (
      select annotator_id, (row_number() over (order by annotator_id collate "C") - 1)::int as idx from (select distinct annotator_id from lab) a
    ),
    itm as (
      select i.id, (row_number() over (order by i.id) - 1)::int as idx, i.is_blind, i.is_control, i.known_class_id, i.final_class_id
      from items i where i.project_id = ${projectId} and i.id in (select item_id from lab)
    )
    select
      coalesce((select version from knn_state where project_id = ${projectId}), 0)::text as version,
      (select count(*) from lab)::int as labels,
      coalesce((
        select string_agg(concat_ws(' ', itm.idx, ann.idx, c.idx,
            lab.took_suggestion::int + 2 * lab.shown::int + 4 * lab.has_snapshot::int, coalesce(t.idx, -1)), ';' order by itm.idx, ann.idx)
        from lab
        join itm on itm.id = lab.item_id
        join ann on ann.annotator_id = lab.annotator_id
        join cls c on c.id = lab.class_id
        left join cls t on t.id = lab.top
      ), '') as label_text,
      coalesce((
        select string_agg(concat_ws(' ', itm.idx, itm.is_blind::int,
            case when itm.is_control then coalesce(k.idx, -1) else -1 end, coalesce(f.idx, -1)), ';' order by itm.idx)
        from itm
        left join cls k on k.id = itm.known_class_id
        left join cls f on f.id = itm.final_class_id
      ), '') as item_text,
      (select array_agg(annotator_id order by idx) from ann) as annotator_ids,
      (select array_agg(id order by idx) from cls) as class_ids`);
  const row = res.rows[0];
  return {
    version: Number(row.version),
    labels: row.labels,
    labelText: row.label_text,
    itemText: row.item_text,
    annotatorIds: row.annotator_ids ?? [],
    classIds: (row.class_ids ?? []).map(Number),
  };
}

export async function getKnnVersionByProjectId({ projectId, tx = db }: { projectId: number; tx?: DbOrTx }): Promise<number> {
  const res = await tx.execute<{ version: string }>(sql`select coalesce((select version from knn_state where project_id = ${projectId}), 0)::text as version`);
  return Number(res.rows[0].version);
}

export async function countLiveLabelsByProjectId({ projectId, tx = db }: { projectId: number; tx?: DbOrTx }): Promise<number> {
  const res = await tx.execute<{ n: number }>(sql`select count(*)::int as n from labels where project_id = ${projectId} and undone_at is null`);
  return res.rows[0].n;
}

export type AgreementReportRow = {
  id: number;
  status: "pending" | "running" | "succeeded" | "failed" | "cancelled";
  knnVersion: number | null;
  result: unknown;
  params: Record<string, unknown>;
  message: string | null;
  finishedAt: Date | null;
};

/** The project's cached agreement report (one row per project; the newest if several). */
export async function getAgreementReportByProjectId({ projectId, tx = db }: { projectId: number; tx?: DbOrTx }): Promise<AgreementReportRow | null> {
  const res = await tx.execute<{ id: number; status: AgreementReportRow["status"]; knn_version: string | null; result: unknown; params: Record<string, unknown>; message: string | null; finished_at: Date | null }>(sql`
    select id, status, knn_version::text as knn_version, result, params, message, finished_at
    from reports where project_id = ${projectId} and kind = 'agreement' order by created_at desc, id desc limit 1`);
  const r = res.rows[0];
  if (!r) return null;
  return { id: r.id, status: r.status, knnVersion: r.knn_version == null ? null : Number(r.knn_version), result: r.result, params: r.params ?? {}, message: r.message, finishedAt: r.finished_at ? new Date(r.finished_at) : null };
}

/** Serialises agreement work per project within a transaction (pg_advisory_xact_lock, released at commit). */
export async function lockAgreementByProjectId({ projectId, tx }: { projectId: number; tx: DbOrTx }) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext('vicinal:agreement'), ${projectId})`);
}

/** Writes the project's one agreement row (update in place, or insert), dropping any older duplicates. */
export async function saveAgreementReportByProjectId({
  projectId,
  tx,
  values,
}: {
  projectId: number;
  tx: DbOrTx;
  values: { status: AgreementReportRow["status"]; knnVersion?: number | null; result?: unknown; params?: Record<string, unknown>; message?: string | null; finished?: boolean };
}) {
  const current = await getAgreementReportByProjectId({ projectId, tx });
  const result = values.result === undefined ? undefined : JSON.stringify(values.result);
  const params = values.params === undefined ? undefined : JSON.stringify(values.params);
  if (!current) {
    await tx.execute(sql`
      insert into reports (project_id, kind, status, progress, params, result, knn_version, message, finished_at)
      values (${projectId}, 'agreement', ${values.status}, ${values.status === "succeeded" ? 1 : 0}, ${params ?? "{}"}::jsonb,
        ${result ?? null}::jsonb, ${values.knnVersion ?? null}, ${values.message ?? null}, ${values.finished ? sql`now()` : null})`);
    return;
  }
  await tx.execute(sql`
    update reports set status = ${values.status},
      progress = ${values.status === "succeeded" ? 1 : 0},
      params = ${params === undefined ? sql`params` : sql`${params}::jsonb`},
      result = ${result === undefined ? sql`result` : sql`${result}::jsonb`},
      knn_version = ${values.knnVersion === undefined ? sql`knn_version` : values.knnVersion},
      message = ${values.message === undefined ? sql`message` : values.message},
      finished_at = ${values.finished ? sql`now()` : sql`finished_at`}
    where id = ${current.id}`);
  await tx.execute(sql`delete from reports where project_id = ${projectId} and kind = 'agreement' and id <> ${current.id}`);
}

/** Display names of annotators and the project's classes, read fresh so renames show at once. */
export async function listAgreementNamesByProjectId({ projectId, userIds }: { projectId: number; userIds: string[] }) {
  const classes = await db.execute<{ id: number; name: string; colour: string }>(sql`select id, name, colour from label_classes where project_id = ${projectId}`);
  const people = userIds.length
    ? await db.execute<{ id: string; name: string | null; email: string }>(sql`select id, name, email from users where id in (${sql.join(userIds.map((id) => sql`${id}`), sql`, `)})`)
    : { rows: [] };
  return { classes: classes.rows, users: people.rows };
}
