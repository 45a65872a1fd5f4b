import "server-only";
import { and, desc, eq, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { disputes, items, labels, rulings } from "@/db/schema";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { markKnnChanged } from "@/lib/suggest";
import { UNDO_WINDOW_SECONDS } from "./constants";

/**
 * Undoes the caller's live label on an item, only within UNDO_WINDOW_SECONDS of its creation (measured by the
 * database clock). Any consensus the label caused is reverted (final label cleared, its open dispute removed),
 * and the item is leased back to the annotator so they can label it again.
 */
export async function undoLabel({ projectId, itemId, userId }: { projectId: number; itemId: number; userId: string }) {
  return db.transaction(async (tx) => {
    const [item] = await tx.select().from(items).where(and(eq(items.id, itemId), eq(items.projectId, projectId))).for("update");
    if (!item) throw new AppError("not_found:item", "No such item in this project.");
    const [label] = await tx
      .select({ id: labels.id, classId: labels.classId, age: sql<number>`extract(epoch from now() - ${labels.createdAt})::float8` })
      .from(labels)
      .where(and(eq(labels.itemId, itemId), eq(labels.annotatorId, userId), isNull(labels.undoneAt)))
      .orderBy(desc(labels.id))
      .limit(1);
    if (!label) throw new AppError("not_found:label", "You have no label on this item to undo.");
    if (label.age > UNDO_WINDOW_SECONDS) {
      throw new AppError("conflict:undo_window", `Labels can be undone only within ${UNDO_WINDOW_SECONDS} seconds; this one is ${Math.floor(label.age)} seconds old.`);
    }
    const [open] = await tx.select().from(disputes).where(and(eq(disputes.itemId, itemId), eq(disputes.status, "open"))).for("update");
    const [ruled] = await tx.select({ id: rulings.id }).from(rulings).innerJoin(disputes, eq(disputes.id, rulings.disputeId)).where(eq(disputes.itemId, itemId)).limit(1);
    if (item.finalSource === "ruling" || ruled || (open && open.reason !== "disagreement")) {
      throw new AppError("conflict:undo_reviewed", "A reviewer is already handling this item; it can no longer be undone.");
    }
    const [undone] = await tx.update(labels).set({ undoneAt: new Date() }).where(eq(labels.id, label.id)).returning();
    if (open) await tx.delete(disputes).where(eq(disputes.id, open.id));
    const remaining = item.labelCount - 1;
    await tx
      .update(items)
      .set(
        item.isControl
          ? { labelCount: Math.max(0, remaining) }
          : { labelCount: Math.max(0, remaining), status: remaining > 0 ? "in_progress" : "unlabelled", finalClassId: null, finalSource: null, decidedAt: null },
      )
      .where(eq(items.id, itemId));
    await tx.execute(sql`
      insert into assignments (item_id, user_id, project_id, leased_until, created_at)
      values (${itemId}, ${userId}, ${projectId}, now() + make_interval(secs => ${env.LEASE_SECONDS}), now())
      on conflict (item_id, user_id) do update set leased_until = excluded.leased_until`);
    await markKnnChanged(tx, projectId, [itemId]);
    return undone;
  });
}
