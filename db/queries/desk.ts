import "server-only";
import { createHmac } from "node:crypto";
import { sql } from "drizzle-orm";
import { db } from "@/db";
import type { SuggestionSnapshot } from "@/db/schema";
import { env } from "@/lib/env";
import { SYNC_SETTLE_SECONDS } from "@/lib/labelling/constants";

/** Counters for the Desk: the caller's labels since local midnight, and what is left in the project. */
export async function getDeskStatsByUserId({ projectId, userId, overlap, timeZone }: { projectId: number; userId: string; overlap: number; timeZone: string }) {
  const res = await db.execute<{ done_today: number; done_total: number; remaining_items: number; open_slots: number; for_you: number }>(sql`
    with open_items as (
      select i.id, i.label_count from items i
      where i.project_id = ${projectId} and not i.is_control and i.final_class_id is null
        and i.status in ('unlabelled', 'in_progress') and i.label_count < ${overlap}
        and not exists (select 1 from disputes d where d.item_id = i.id and d.status = 'open')
    )
    select
      (select count(*)::int from labels l where l.project_id = ${projectId} and l.annotator_id = ${userId} and l.undone_at is null
        and l.created_at >= (date_trunc('day', now() at time zone ${timeZone}) at time zone ${timeZone})) as done_today,
      (select count(*)::int from labels l where l.project_id = ${projectId} and l.annotator_id = ${userId} and l.undone_at is null) as done_total,
      (select count(*)::int from open_items) as remaining_items,
      (select coalesce(sum(${overlap} - label_count), 0)::int from open_items) as open_slots,
      (select count(*)::int from open_items o
        where not exists (select 1 from labels l where l.item_id = o.id and l.annotator_id = ${userId} and l.undone_at is null)
          and not exists (select 1 from item_flags f where f.item_id = o.id and f.user_id = ${userId})) as for_you`);
  const r = res.rows[0];
  return { doneToday: r.done_today, doneTotal: r.done_total, remainingItems: r.remaining_items, openSlots: r.open_slots, remainingForYou: r.for_you };
}

/** A stable pseudonym of an annotator within one project: lets anyone count per annotator without learning who. */
export function annotatorKey(projectId: number, userId: string): string {
  return `a-${createHmac("sha256", env.AUTH_SECRET).update(`annotator:${projectId}:${userId}`).digest("base64url").slice(0, 10)}`;
}

export type SyncedLabel = {
  id: number;
  itemId: number;
  externalId: string;
  classId: number;
  annotatorKey: string;
  annotator?: { id: string; name: string | null };
  tookSuggestion: boolean;
  suggestion: SuggestionSnapshot | null;
  createdAt: string;
  undoneAt: string | null;
};

/**
 * Settled labels (older than the undo window plus a grace) with id > afterId, in id order. Once returned, a row
 * never changes again, so a client that stores the last id it saw never misses a label or an undo.
 */
export async function listLabelsSinceByProjectId({ projectId, afterId, limit, withNames }: { projectId: number; afterId: number; limit: number; withNames: boolean }): Promise<SyncedLabel[]> {
  const res = await db.execute<{ id: string; item_id: number; external_id: string; class_id: number; annotator_id: string; name: string | null; took_suggestion: boolean; suggestion: SuggestionSnapshot | null; created_at: Date; undone_at: Date | null }>(sql`
    select l.id, l.item_id, i.external_id, l.class_id, l.annotator_id, u.name, l.took_suggestion, l.suggestion, l.created_at, l.undone_at
    from labels l join items i on i.id = l.item_id join users u on u.id = l.annotator_id
    where l.project_id = ${projectId} and l.id > ${afterId}
      and l.created_at < now() - make_interval(secs => ${SYNC_SETTLE_SECONDS})
    order by l.id asc
    limit ${limit}`);
  return res.rows.map((r) => ({
    id: Number(r.id),
    itemId: r.item_id,
    externalId: r.external_id,
    classId: r.class_id,
    annotatorKey: annotatorKey(projectId, r.annotator_id),
    annotator: withNames ? { id: r.annotator_id, name: r.name } : undefined,
    tookSuggestion: r.took_suggestion,
    suggestion: r.suggestion,
    createdAt: new Date(r.created_at).toISOString(),
    undoneAt: r.undone_at ? new Date(r.undone_at).toISOString() : null,
  }));
}
