import "server-only";
import { type SQL, sql } from "drizzle-orm";
import { db, type Tx } from "@/db";
import { env } from "@/lib/env";
import type { QueueOrder } from "@/lib/projects/settings";

/** Ties always fall back to import order, so the queue is deterministic for a given ranking. */
export function queueOrderSql(order: QueueOrder): SQL {
  switch (order) {
    case "least_confident":
      return sql`i.score_least_confident desc nulls last, i.seq asc`;
    case "smallest_margin":
      return sql`i.score_margin asc nulls last, i.seq asc`;
    case "highest_entropy":
      return sql`i.score_entropy desc nulls last, i.seq asc`;
    case "random":
      return sql`i.random_key asc, i.seq asc`;
    case "import_order":
      return sql`i.seq asc`;
  }
}

export type LeaseInput = { projectId: number; userId: string; overlap: number; queueOrder: QueueOrder; controlRate: number; exclude: number[]; random?: () => number };
export type Lease = { itemId: number; leasedUntil: Date; renewed: boolean };

const idList = (ids: number[]) => (ids.length ? sql`array[${sql.join(ids.map((i) => sql`${i}`), sql`, `)}]::int[]` : sql`array[]::int[]`);

/** Items this annotator may get: never one they labelled (live) or skipped/flagged, never one they already hold. */
function mineFilter(userId: string, exclude: number[]): SQL {
  return sql`i.id <> all(${idList(exclude)})
    and not exists (select 1 from labels l where l.item_id = i.id and l.annotator_id = ${userId} and l.undone_at is null)
    and not exists (select 1 from item_flags f where f.item_id = i.id and f.user_id = ${userId})
    and not exists (select 1 from assignments a where a.item_id = i.id and a.user_id = ${userId} and a.leased_until > now())`;
}

const scoreColumns: Partial<Record<QueueOrder, string>> = {
  least_confident: "score_least_confident",
  smallest_margin: "score_margin",
  highest_entropy: "score_entropy",
};

/** Regular items with a free slot: live labels + others' live leases < overlap, no final label, no open dispute. */
async function lockRegularPass(tx: Tx, input: LeaseInput, skip: number[], extra: SQL, order: SQL, limit: number): Promise<number[]> {
  const res = await tx.execute<{ id: number }>(sql`
    select i.id from items i
    where i.project_id = ${input.projectId} and not i.is_control
      and i.status in ('unlabelled', 'in_progress') and i.final_class_id is null
      and ${extra}
      and i.label_count < ${input.overlap}
      and not exists (select 1 from disputes d where d.item_id = i.id and d.status = 'open')
      and ${mineFilter(input.userId, [...input.exclude, ...skip])}
      and i.label_count + (select count(*) from assignments a where a.item_id = i.id and a.user_id <> ${input.userId} and a.leased_until > now()) < ${input.overlap}
    order by ${order}
    limit ${limit}
    for update of i skip locked`);
  return res.rows.map((r) => Number(r.id));
}

/**
 * Score orders read scored items first (through their partial index), then unscored ones in import order:
 * the same order as `score … nulls last, seq`, without an index that every import would have to maintain.
 */
async function lockRegularCandidates(tx: Tx, input: LeaseInput, skip: number[]): Promise<number[]> {
  const column = scoreColumns[input.queueOrder];
  if (!column) return lockRegularPass(tx, input, skip, sql`true`, queueOrderSql(input.queueOrder), 6);
  const scored = await lockRegularPass(tx, input, skip, sql`${sql.raw(`i.${column}`)} is not null`, queueOrderSql(input.queueOrder), 6);
  if (scored.length >= 6) return scored;
  const unscored = await lockRegularPass(tx, input, [...skip, ...scored], sql`${sql.raw(`i.${column}`)} is null`, sql`i.seq asc`, 6 - scored.length);
  return [...scored, ...unscored];
}

/** Control items (known label) go to every annotator once; they have no overlap cap and never reach consensus. */
async function lockControlCandidate(tx: Tx, input: LeaseInput): Promise<number | null> {
  const res = await tx.execute<{ id: number }>(sql`
    select i.id from items i
    where i.project_id = ${input.projectId} and i.is_control and i.known_class_id is not null
      and ${mineFilter(input.userId, input.exclude)}
    order by i.random_key asc
    limit 1
    for update of i skip locked`);
  return res.rows[0] ? Number(res.rows[0].id) : null;
}

/**
 * Re-counts under the item's row lock, in a fresh statement: every label and lease write on an item
 * holds the same lock, so this sees all committed slots, which the candidate query's snapshot may not.
 */
async function slotStillFree(tx: Tx, itemId: number, userId: string, overlap: number): Promise<boolean> {
  const res = await tx.execute<{ used: number; open: boolean; final: number | null; status: string }>(sql`
    select
      (select count(*)::int from labels l where l.item_id = i.id and l.undone_at is null)
      + (select count(*)::int from assignments a where a.item_id = i.id and a.user_id <> ${userId} and a.leased_until > now()) as used,
      exists (select 1 from disputes d where d.item_id = i.id and d.status = 'open') as open,
      i.final_class_id as final, i.status
    from items i where i.id = ${itemId}`);
  const row = res.rows[0];
  return Boolean(row) && row.used < overlap && !row.open && row.final == null && (row.status === "unlabelled" || row.status === "in_progress");
}

async function takeLease(tx: Tx, input: LeaseInput, itemId: number): Promise<Lease> {
  const res = await tx.execute<{ leased_until: Date }>(sql`
    insert into assignments (item_id, user_id, project_id, leased_until, created_at)
    values (${itemId}, ${input.userId}, ${input.projectId}, now() + make_interval(secs => ${env.LEASE_SECONDS}), now())
    on conflict (item_id, user_id) do update set leased_until = excluded.leased_until, created_at = excluded.created_at
    returning leased_until`);
  return { itemId, leasedUntil: new Date(res.rows[0].leased_until), renewed: false };
}

/**
 * The annotator's next item: an item they already hold (not excluded) is renewed and returned first;
 * otherwise one new lease is taken in a transaction with `for update skip locked`, so two annotators
 * never both take the last free slot of an item.
 */
export async function leaseNextItem(input: LeaseInput): Promise<Lease | null> {
  const random = input.random ?? Math.random;
  return db.transaction(async (tx) => {
    await tx.execute(sql`delete from assignments where user_id = ${input.userId} and project_id = ${input.projectId} and leased_until <= now()`);
    const held = await tx.execute<{ item_id: number; leased_until: Date }>(sql`
      update assignments a set leased_until = now() + make_interval(secs => ${env.LEASE_SECONDS})
      where a.item_id = (
        select a2.item_id from assignments a2 join items i on i.id = a2.item_id
        where a2.user_id = ${input.userId} and a2.project_id = ${input.projectId} and a2.leased_until > now()
          and a2.item_id <> all(${idList(input.exclude)})
          and i.final_class_id is null and i.status in ('unlabelled', 'in_progress', 'control')
          and not exists (select 1 from disputes d where d.item_id = i.id and d.status = 'open')
        order by a2.created_at asc, a2.item_id asc limit 1)
      and a.user_id = ${input.userId}
      returning a.item_id, a.leased_until`);
    if (held.rows[0]) return { itemId: Number(held.rows[0].item_id), leasedUntil: new Date(held.rows[0].leased_until), renewed: true };

    const wantControl = input.controlRate > 0 && random() < input.controlRate;
    if (wantControl) {
      const control = await lockControlCandidate(tx, input);
      if (control != null) return takeLease(tx, input, control);
    }
    const rejected: number[] = [];
    for (let round = 0; round < 5; round += 1) {
      const ids = await lockRegularCandidates(tx, input, rejected);
      if (!ids.length) break;
      for (const id of ids) {
        if (await slotStillFree(tx, id, input.userId, input.overlap)) return takeLease(tx, input, id);
        rejected.push(id);
      }
    }
    return null;
  });
}

/** Releases the annotator's lease on one item (after a label, skip or flag). */
export async function releaseLease(tx: Tx, itemId: number, userId: string) {
  await tx.execute(sql`delete from assignments where item_id = ${itemId} and user_id = ${userId}`);
}
