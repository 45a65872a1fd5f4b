import "server-only";
import { sql } from "drizzle-orm";
import { named, pgTransaction, type PgTx, type Tx } from "@/db";
import { env } from "@/lib/env";
import type { QueueOrder } from "@/lib/projects/settings";

/** Ties always fall back to import order, so the queue is deterministic for a given ranking. */
const queueOrderText: Record<QueueOrder, string> = {
  least_confident: "i.score_least_confident desc nulls last, i.seq asc",
  smallest_margin: "i.score_margin asc nulls last, i.seq asc",
  highest_entropy: "i.score_entropy desc nulls last, i.seq asc",
  random: "i.random_key asc, i.seq asc",
  import_order: "i.seq asc",
};

export type LeaseInput = { projectId: number; userId: string; overlap: number; queueOrder: QueueOrder; controlRate: number; exclude: number[]; random?: () => number };
export type Lease = { itemId: number; leasedUntil: Date; renewed: boolean };

/*
 * Every statement below is a named statement with fixed text (PostgreSQL plans it once per connection); the variable
 * parts are parameters: $1 project, $2 user, $3 item ids to leave out, then what each statement needs.
 */

/** Items this annotator may get: never one they labelled (live) or skipped/flagged, never one they already hold. */
const mineFilter = `i.id <> all($3::int[])
    and not exists (select 1 from labels l where l.item_id = i.id and l.annotator_id = $2 and l.undone_at is null)
    and not exists (select 1 from item_flags f where f.item_id = i.id and f.user_id = $2)
    and not exists (select 1 from assignments a where a.item_id = i.id and a.user_id = $2 and a.leased_until > now())`;

const scoreColumns: Partial<Record<QueueOrder, string>> = {
  least_confident: "score_least_confident",
  smallest_margin: "score_margin",
  highest_entropy: "score_entropy",
};

/** Regular items with a free slot: live labels + others' live leases < overlap ($4), no final label, no open dispute. */
const regularFilter = `i.project_id = $1 and not i.is_control
      and i.status in ('unlabelled', 'in_progress') and i.final_class_id is null
      and i.label_count < $4
      and not exists (select 1 from disputes d where d.item_id = i.id and d.status = 'open')
      and ${mineFilter}
      and i.label_count + (select count(*) from assignments a where a.item_id = i.id and a.user_id <> $2 and a.leased_until > now()) < $4`;

/** Up to $5 of them in queue order, locked, passing over rows another transaction holds. */
function regularPassText(extra: string, order: string) {
  return `
    select i.id from items i
    where ${regularFilter} and ${extra}
    order by ${order}
    limit $5
    for update of i skip locked`;
}

/** Whether any of them exists, locked or not: when the passes found none, were they all held by other transactions? */
async function anyRegularLeft(client: PgTx, input: LeaseInput, skip: number[]): Promise<boolean> {
  const res = await named<{ left: boolean }>(client, "vicinal_lease_any_left", `select exists (select 1 from items i where ${regularFilter}) as left`, [
    input.projectId,
    input.userId,
    [...input.exclude, ...skip],
    input.overlap,
  ]);
  return res.rows[0].left;
}

async function lockRegularPass(client: PgTx, input: LeaseInput, skip: number[], pass: "all" | "scored" | "unscored", limit: number): Promise<number[]> {
  const column = scoreColumns[input.queueOrder];
  const text =
    pass === "all"
      ? regularPassText("true", queueOrderText[input.queueOrder])
      : regularPassText(`i.${column} is ${pass === "scored" ? "not null" : "null"}`, pass === "scored" ? queueOrderText[input.queueOrder] : "i.seq asc");
  const res = await named<{ id: number }>(client, `vicinal_lease_${input.queueOrder}_${pass}`, text, [input.projectId, input.userId, [...input.exclude, ...skip], input.overlap, limit]);
  return res.rows.map((r) => Number(r.id));
}

/**
 * Score orders read scored items first (through their partial index), then unscored ones in import order:
 * the same order as `score … nulls last, seq`, without an index that every import would have to maintain.
 */
async function lockRegularCandidates(client: PgTx, input: LeaseInput, skip: number[]): Promise<number[]> {
  if (!scoreColumns[input.queueOrder]) return lockRegularPass(client, input, skip, "all", 6);
  const scored = await lockRegularPass(client, input, skip, "scored", 6);
  if (scored.length >= 6) return scored;
  const unscored = await lockRegularPass(client, input, [...skip, ...scored], "unscored", 6 - scored.length);
  return [...scored, ...unscored];
}

/** Control items (known label) go to every annotator once; they have no overlap cap and never reach consensus. */
async function lockControlCandidate(client: PgTx, input: LeaseInput): Promise<number | null> {
  const res = await named<{ id: number }>(
    client,
    "vicinal_lease_control",
    `select i.id from items i
     where i.project_id = $1 and i.is_control and i.known_class_id is not null
       and ${mineFilter}
     order by i.random_key asc
     limit 1
     for update of i skip locked`,
    [input.projectId, input.userId, input.exclude],
  );
  return res.rows[0] ? Number(res.rows[0].id) : null;
}

/**
 * Takes the lease if the item still has a free slot, re-counted under the item's row lock in this fresh statement: every
 * label and lease write on an item holds the same lock, so it sees all committed slots, which the candidate query's
 * snapshot may not. Null when the slot was taken meanwhile.
 */
async function takeLeaseIfFree(client: PgTx, input: LeaseInput, itemId: number): Promise<Lease | null> {
  const res = await named<{ leased_until: Date }>(
    client,
    "vicinal_lease_take_if_free",
    `insert into assignments (item_id, user_id, project_id, leased_until, created_at)
     select i.id, $2, $1, now() + make_interval(secs => $5), now()
     from items i
     where i.id = $3 and i.final_class_id is null and i.status in ('unlabelled', 'in_progress')
       and not exists (select 1 from disputes d where d.item_id = i.id and d.status = 'open')
       and (select count(*)::int from labels l where l.item_id = i.id and l.undone_at is null)
         + (select count(*)::int from assignments a where a.item_id = i.id and a.user_id <> $2 and a.leased_until > now()) < $4
     on conflict (item_id, user_id) do update set leased_until = excluded.leased_until, created_at = excluded.created_at
     returning leased_until`,
    [input.projectId, input.userId, itemId, input.overlap, env.LEASE_SECONDS],
  );
  return res.rows[0] ? { itemId, leasedUntil: new Date(res.rows[0].leased_until), renewed: false } : null;
}

async function takeLease(client: PgTx, input: LeaseInput, itemId: number): Promise<Lease> {
  const res = await named<{ leased_until: Date }>(
    client,
    "vicinal_lease_take",
    `insert into assignments (item_id, user_id, project_id, leased_until, created_at)
     values ($3, $2, $1, now() + make_interval(secs => $4), now())
     on conflict (item_id, user_id) do update set leased_until = excluded.leased_until, created_at = excluded.created_at
     returning leased_until`,
    [input.projectId, input.userId, itemId, env.LEASE_SECONDS],
  );
  return { itemId, leasedUntil: new Date(res.rows[0].leased_until), renewed: false };
}

/**
 * The annotator's next item: an item they already hold (not excluded) is renewed and returned first;
 * otherwise one new lease is taken in a transaction with `for update skip locked`, so two annotators
 * never both take the last free slot of an item.
 */
export async function leaseNextItem(input: LeaseInput): Promise<Lease | null> {
  // Items skipped only because other transactions held them for a moment (a label committing, another lease) are
  // free again a few milliseconds later: try again rather than tell the annotator the queue is empty.
  for (let attempt = 0; ; attempt += 1) {
    const lease = await leaseOnce(input);
    if (lease !== "busy") return lease;
    if (attempt >= 5) return null;
    await new Promise((r) => setTimeout(r, 10 * 2 ** attempt));
  }
}

async function leaseOnce(input: LeaseInput): Promise<Lease | null | "busy"> {
  const random = input.random ?? Math.random;
  return pgTransaction(async (client) => {
    // The caller's expired leases are dropped in the same statement that renews a live one.
    const held = await named<{ item_id: number; leased_until: Date }>(
      client,
      "vicinal_lease_held",
      `with expired as (delete from assignments where user_id = $2 and project_id = $1 and leased_until <= now())
       update assignments a set leased_until = now() + make_interval(secs => $4)
       where a.item_id = (
         select a2.item_id from assignments a2 join items i on i.id = a2.item_id
         where a2.user_id = $2 and a2.project_id = $1 and a2.leased_until > now()
           and a2.item_id <> all($3::int[])
           and i.final_class_id is null and i.status in ('unlabelled', 'in_progress', 'control')
           and not exists (select 1 from disputes d where d.item_id = i.id and d.status = 'open')
         order by a2.created_at asc, a2.item_id asc limit 1)
       and a.user_id = $2
       returning a.item_id, a.leased_until`,
      [input.projectId, input.userId, input.exclude, env.LEASE_SECONDS],
    );
    if (held.rows[0]) return { itemId: Number(held.rows[0].item_id), leasedUntil: new Date(held.rows[0].leased_until), renewed: true };

    const wantControl = input.controlRate > 0 && random() < input.controlRate;
    if (wantControl) {
      const control = await lockControlCandidate(client, input);
      if (control != null) return takeLease(client, input, control);
    }
    const rejected: number[] = [];
    for (let round = 0; round < 5; round += 1) {
      const ids = await lockRegularCandidates(client, input, rejected);
      if (!ids.length) break;
      for (const id of ids) {
        const lease = await takeLeaseIfFree(client, input, id);
        if (lease) return lease;
        rejected.push(id);
      }
    }
    return (await anyRegularLeft(client, input, rejected)) ? "busy" : null;
  });
}

/** Releases the annotator's lease on one item (after a label, skip or flag). */
export async function releaseLease(tx: Tx, itemId: number, userId: string) {
  await tx.execute(sql`delete from assignments where item_id = ${itemId} and user_id = ${userId}`);
}
