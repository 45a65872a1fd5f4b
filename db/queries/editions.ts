// No "server-only" here: the worker (plain Node) runs the edition job with these queries too.
import { type SQL, and, desc, eq, lt, sql } from "drizzle-orm";
import { type DbOrTx, type Tx, db } from "@/db";
import { type Edition, type SuggestionSnapshot, editions, users } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { IncludeSource } from "@/lib/editions/options";
import type { SourceItem } from "@/lib/editions/rows";

export type EditionWithCreator = Edition & { creator: { id: string; name: string | null; email: string } | null };

/** Creates a pending edition with the project's next number; numbers are taken under a per-project lock. */
export async function insertEditionByProjectId({ tx, projectId, userId, options }: { tx: Tx; projectId: number; userId: string; options: Record<string, unknown> }): Promise<Edition> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext('vicinal:edition-number'), ${projectId})`);
  const res = await tx.execute<{ next: number }>(sql`select coalesce(max(number), 0)::int + 1 as next from editions where project_id = ${projectId}`);
  const [row] = await tx.insert(editions).values({ projectId, number: res.rows[0].next, status: "pending", options, createdBy: userId }).returning();
  return row;
}

/** A project's editions, newest first, `limit` after the cursor's number. */
export async function listEditionsByProjectId({ projectId, beforeNumber, limit }: { projectId: number; beforeNumber?: number | null; limit: number }): Promise<EditionWithCreator[]> {
  const rows = await db
    .select({ edition: editions, creator: { id: users.id, name: users.name, email: users.email } })
    .from(editions)
    .leftJoin(users, eq(users.id, editions.createdBy))
    .where(and(eq(editions.projectId, projectId), beforeNumber ? lt(editions.number, beforeNumber) : undefined))
    .orderBy(desc(editions.number))
    .limit(limit);
  return rows.map((r) => ({ ...r.edition, creator: r.creator?.id ? r.creator : null }));
}

/** One edition of this project; another project's edition is "not found". */
export async function getEditionById({ projectId, editionId, tx = db }: { projectId: number; editionId: number; tx?: DbOrTx }): Promise<EditionWithCreator> {
  const rows = await tx
    .select({ edition: editions, creator: { id: users.id, name: users.name, email: users.email } })
    .from(editions)
    .leftJoin(users, eq(users.id, editions.createdBy))
    .where(and(eq(editions.projectId, projectId), eq(editions.id, editionId)))
    .limit(1);
  const row = rows[0];
  if (!row) throw new AppError("not_found:edition", "No such edition in this project.");
  return { ...row.edition, creator: row.creator?.id ? row.creator : null };
}

export async function findEditionForJob({ editionId, tx = db }: { editionId: number; tx?: DbOrTx }): Promise<Edition | null> {
  const [row] = await tx.select().from(editions).where(eq(editions.id, editionId)).limit(1);
  return row ?? null;
}

export async function setEditionStatusById({ editionId, status, message = null }: { editionId: number; status: "running" | "failed"; message?: string | null }) {
  await db.update(editions).set({ status, message }).where(and(eq(editions.id, editionId), sql`${editions.status} <> 'succeeded'`));
}

export async function completeEditionById({ tx, editionId, manifest, objectKeys }: { tx: Tx; editionId: number; manifest: Record<string, unknown>; objectKeys: Record<string, string> }): Promise<boolean> {
  const done = await tx
    .update(editions)
    .set({ status: "succeeded", manifest, objectKeys, message: null, publishedAt: new Date() })
    .where(eq(editions.id, editionId))
    .returning({ id: editions.id });
  return done.length === 1;
}

export async function getUserContactById({ userId, tx = db }: { userId: string; tx?: DbOrTx }): Promise<{ email: string; deactivated: boolean } | null> {
  const [u] = await tx.select({ email: users.email, deactivatedAt: users.deactivatedAt }).from(users).where(eq(users.id, userId)).limit(1);
  return u ? { email: u.email, deactivated: u.deactivatedAt !== null } : null;
}

export async function deleteEditionById({ tx, editionId }: { tx: Tx; editionId: number }) {
  await tx.delete(editions).where(eq(editions.id, editionId));
}

/** Only one worker builds an edition at a time (transaction-scoped advisory lock; false when another holds it). */
export async function tryLockEditionById({ tx, editionId }: { tx: Tx; editionId: number }): Promise<boolean> {
  const res = await tx.execute<{ ok: boolean }>(sql`select pg_try_advisory_xact_lock(hashtext('vicinal:edition'), ${editionId}) as ok`);
  return res.rows[0].ok;
}

// ---------- The snapshot the job reads (all inside one REPEATABLE READ transaction) ----------

export type SnapshotProject = {
  id: number;
  name: string;
  settings: Record<string, unknown>;
  featureSchema: unknown;
  knnVersion: number;
  classes: Array<{ id: number; name: string; colour: string }>;
};

export async function getSnapshotProject({ tx, projectId }: { tx: Tx; projectId: number }): Promise<SnapshotProject> {
  const p = await tx.execute<{ id: number; name: string; settings: Record<string, unknown>; feature_schema: unknown; version: string }>(sql`
    select p.id, p.name, p.settings, p.feature_schema, coalesce(k.version, 0)::text as version
    from projects p left join knn_state k on k.project_id = p.id where p.id = ${projectId}`);
  const c = await tx.execute<{ id: number; name: string; colour: string }>(sql`select id, name, colour from label_classes where project_id = ${projectId} order by position, id`);
  const row = p.rows[0];
  if (!row) throw new AppError("not_found:project", "No such project.");
  return { id: row.id, name: row.name, settings: row.settings, featureSchema: row.feature_schema, knnVersion: Number(row.version), classes: c.rows };
}

/**
 * The exported items with their final class and label source: a final label when there is one, else the known
 * class of a control item ("control"), else "disputed" for items waiting for a ruling. Only the chosen sources.
 */
function includedItems(projectId: number, include: IncludeSource[]): SQL {
  return sql`(select * from (
      select i.id, i.external_id, i.fields, i.vector, i.is_blind, i.is_control,
        case when i.final_class_id is not null then i.final_class_id when i.is_control then i.known_class_id end as class_id,
        case when i.final_class_id is not null then coalesce(i.final_source::text, 'agreed')
             when i.is_control and i.known_class_id is not null then 'control'
             when i.status = 'disputed' then 'disputed' end as source
      from items i where i.project_id = ${projectId}) s
    where s.source in (${sql.join(include.map((x) => sql`${x}`), sql`, `)}))`;
}

export async function getSnapshotShape({ tx, projectId, include }: { tx: Tx; projectId: number; include: IncludeSource[] }) {
  const inc = includedItems(projectId, include);
  const keys = await tx.execute<{ key: string }>(sql`select distinct k as key from ${inc} x, jsonb_object_keys(x.fields) k order by 1`);
  const vec = await tx.execute<{ has: boolean }>(sql`select exists (select 1 from ${inc} x where x.vector is not null) as has`);
  const ann = await tx.execute<{ id: string; email: string }>(sql`
    select distinct l.annotator_id as id, u.email from labels l
    join users u on u.id = l.annotator_id
    where l.project_id = ${projectId} and l.undone_at is null and l.item_id in (select x.id from ${inc} x)`);
  return { fieldKeys: keys.rows.map((r) => r.key), hasVector: vec.rows[0].has, annotators: ann.rows };
}

/** Runs `query` as a server-side cursor in the transaction and yields it in batches (memory holds one batch). */
async function* cursorBatches<T extends Record<string, unknown>>(tx: Tx, name: string, query: SQL, batch: number): AsyncGenerator<T[]> {
  await tx.execute(sql`declare ${sql.raw(name)} no scroll cursor for ${query}`);
  try {
    for (;;) {
      const res = await tx.execute<T>(sql.raw(`fetch ${batch} from ${name}`));
      if (res.rows.length === 0) return;
      yield res.rows as T[];
    }
  } finally {
    await tx.execute(sql.raw(`close ${name}`));
  }
}

/** (item id, stratum) of every exported item in id order: the split's input. Stratum = final class id, -1 for none. */
export async function* streamSplitKeys({ tx, projectId, include, batch = 20_000 }: { tx: Tx; projectId: number; include: IncludeSource[]; batch?: number }) {
  const q = sql`select x.id, coalesce(x.class_id, -1) as class_id from ${includedItems(projectId, include)} x order by x.id`;
  for await (const rows of cursorBatches<{ id: number; class_id: number }>(tx, "edition_split", q, batch)) yield rows;
}

type RawItem = { id: number; external_id: string; fields: Record<string, unknown>; vector: Buffer | null; is_blind: boolean; is_control: boolean; class_id: number | null; source: IncludeSource; labels: Array<{ a: string; e: string | null; c: number; s: SuggestionSnapshot | null }> };

/** The exported items in id order, each with its live labels (oldest first). */
export async function* streamSnapshotItems({ tx, projectId, include, batch = 2_000 }: { tx: Tx; projectId: number; include: IncludeSource[]; batch?: number }): AsyncGenerator<SourceItem[]> {
  const q = sql`
    select x.id, x.external_id, x.fields, x.vector, x.is_blind, x.is_control, x.class_id, x.source,
      coalesce((select json_agg(json_build_object('a', l.annotator_id, 'e', u.email, 'c', l.class_id, 's', l.suggestion) order by l.id)
        from labels l join users u on u.id = l.annotator_id where l.item_id = x.id and l.undone_at is null), '[]'::json) as labels
    from ${includedItems(projectId, include)} x order by x.id`;
  for await (const rows of cursorBatches<RawItem>(tx, "edition_items", q, batch)) {
    yield rows.map((r) => ({
      id: r.id,
      externalId: r.external_id,
      fields: r.fields ?? {},
      vector: r.vector,
      isBlind: r.is_blind,
      isControl: r.is_control,
      classId: r.class_id,
      source: r.source,
      labels: r.labels.map((l) => ({ annotatorId: l.a, email: l.e, classId: l.c, suggestion: l.s })),
    }));
  }
}

/** (external id, final class id, source) in byte order of the external id: the edition's index, which diffs merge. */
export async function* streamIndexEntries({ tx, projectId, include, batch = 20_000 }: { tx: Tx; projectId: number; include: IncludeSource[]; batch?: number }) {
  const q = sql`select x.external_id, x.class_id, x.source from ${includedItems(projectId, include)} x order by x.external_id collate "C"`;
  for await (const rows of cursorBatches<{ external_id: string; class_id: number | null; source: IncludeSource }>(tx, "edition_index", q, batch)) yield rows;
}
