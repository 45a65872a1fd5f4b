import "server-only";
import { and, asc, desc, eq, sql, type SQL } from "drizzle-orm";
import { db } from "@/db";
import { disputes, items, labelClasses, labels, rulings, users } from "@/db/schema";
import { AppError } from "@/lib/errors";

export const itemStatusFilters = ["unlabelled", "in_progress", "labelled", "disputed", "control"] as const;
export const itemSorts = ["seq", "external_id", "top_share"] as const;
export type ItemStatusFilter = (typeof itemStatusFilters)[number];
export type ItemSort = (typeof itemSorts)[number];

export type ItemFilter = { status?: ItemStatusFilter; classId?: number; shareMin?: number; shareMax?: number; q?: string };
export type ItemCursor = { v: string | number; id: number };

const sortExpr: Record<ItemSort, SQL> = {
  seq: sql`${items.seq}`,
  external_id: sql`${items.externalId}`,
  top_share: sql`coalesce(${items.poolTopShare}, -1)`,
};

function whereOf(projectId: number, f: ItemFilter): SQL {
  const parts: SQL[] = [sql`${items.projectId} = ${projectId}`];
  if (f.status === "unlabelled") parts.push(sql`${items.status} = 'unlabelled'`);
  if (f.status === "in_progress") parts.push(sql`${items.status} = 'in_progress'`);
  if (f.status === "labelled") parts.push(sql`${items.finalClassId} is not null`);
  if (f.status === "disputed") parts.push(sql`${items.status} = 'disputed'`);
  if (f.status === "control") parts.push(sql`${items.isControl}`);
  if (f.classId) parts.push(sql`${items.finalClassId} = ${f.classId}`);
  if (f.shareMin !== undefined) parts.push(sql`${items.poolTopShare} >= ${f.shareMin}`);
  if (f.shareMax !== undefined) parts.push(sql`${items.poolTopShare} <= ${f.shareMax}`);
  if (f.q) parts.push(sql`${items.externalId} ilike ${`%${f.q.replace(/[\\%_]/g, (m) => `\\${m}`)}%`}`);
  return sql.join(parts, sql` and `);
}

/** One page of a project's items by keyset (sort value, id): no OFFSET, so page 5 000 costs what page 1 does. */
export async function listItemsByProjectId({ projectId, filter, sort = "seq", dir = "asc", cursor, limit = 100 }: { projectId: number; filter: ItemFilter; sort?: ItemSort; dir?: "asc" | "desc"; cursor: ItemCursor | null; limit?: number }) {
  const key = sortExpr[sort];
  const where = [whereOf(projectId, filter)];
  if (cursor) {
    const v = sort === "seq" ? Number(cursor.v) : sort === "top_share" ? Number(cursor.v) : String(cursor.v);
    where.push(dir === "asc" ? sql`(${key}, ${items.id}) > (${v}, ${cursor.id})` : sql`(${key}, ${items.id}) < (${v}, ${cursor.id})`);
  }
  const order = dir === "asc" ? [asc(key), asc(items.id)] : [desc(key), desc(items.id)];
  const rows = await db
    .select({
      id: items.id,
      externalId: items.externalId,
      status: items.status,
      isControl: items.isControl,
      labelCount: items.labelCount,
      finalClassId: items.finalClassId,
      priorClassId: items.priorClassId,
      poolTopClassId: items.poolTopClassId,
      poolTopShare: items.poolTopShare,
      thumbKey: items.thumbKey,
      seq: items.seq,
      sortValue: sql<string | number>`${key}`,
      fields: items.fields,
    })
    .from(items)
    .where(sql.join(where, sql` and `))
    .orderBy(...order)
    .limit(limit + 1);
  const more = rows.length > limit;
  const page = rows.slice(0, limit);
  const last = page[page.length - 1];
  const next: ItemCursor | null = more && last ? { v: last.sortValue, id: last.id } : null;
  let total: number | null = null;
  if (!cursor) {
    const [row] = await db.select({ n: sql<number>`count(*)::int` }).from(items).where(whereOf(projectId, filter));
    total = row?.n ?? 0;
  }
  return { items: page, next, total };
}

export async function getItemById({ projectId, itemId }: { projectId: number; itemId: number }) {
  const [item] = await db.select().from(items).where(and(eq(items.id, itemId), eq(items.projectId, projectId))).limit(1);
  if (!item) throw new AppError("not_found:item", "No such item in this project.");
  const itemLabels = await db
    .select({
      id: labels.id,
      classId: labels.classId,
      className: labelClasses.name,
      colour: labelClasses.colour,
      annotator: sql<string>`coalesce(${users.name}, ${users.email})`,
      tookSuggestion: labels.tookSuggestion,
      suggestionShown: sql<boolean>`coalesce((${labels.suggestion} ->> 'shown')::boolean, false)`,
      createdAt: labels.createdAt,
      undoneAt: labels.undoneAt,
    })
    .from(labels)
    .innerJoin(labelClasses, eq(labelClasses.id, labels.classId))
    .innerJoin(users, eq(users.id, labels.annotatorId))
    .where(eq(labels.itemId, itemId))
    .orderBy(asc(labels.createdAt));
  const itemDisputes = await db
    .select({
      id: disputes.id,
      reason: disputes.reason,
      status: disputes.status,
      note: disputes.note,
      openedAt: disputes.openedAt,
      closedAt: disputes.closedAt,
      rulingClassId: rulings.classId,
      rulingReason: rulings.reason,
      reviewer: sql<string | null>`(select coalesce(u.name, u.email) from users u where u.id = ${rulings.reviewerId})`,
    })
    .from(disputes)
    .leftJoin(rulings, eq(rulings.disputeId, disputes.id))
    .where(eq(disputes.itemId, itemId))
    .orderBy(asc(disputes.openedAt));
  return { item, labels: itemLabels, disputes: itemDisputes };
}
