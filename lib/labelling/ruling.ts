import "server-only";
import { and, eq } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { disputes, items, labelClasses, rulings, users } from "@/db/schema";
import { writeAudit } from "@/lib/audit";
import { AppError } from "@/lib/errors";
import { markKnnChanged } from "@/lib/suggest";
import { isUniqueViolation } from "./pg-errors";

export type RulingView = { id: number; disputeId: number; classId: number; className: string; reason: string; reviewerId: string; reviewerName: string | null; createdAt: Date };

export async function getRulingByDisputeId(tx: DbOrTx, disputeId: number): Promise<RulingView | null> {
  const [row] = await tx
    .select({ id: rulings.id, disputeId: rulings.disputeId, classId: rulings.classId, className: labelClasses.name, reason: rulings.reason, reviewerId: rulings.reviewerId, reviewerName: users.name, createdAt: rulings.createdAt })
    .from(rulings)
    .innerJoin(labelClasses, eq(labelClasses.id, rulings.classId))
    .innerJoin(users, eq(users.id, rulings.reviewerId))
    .where(eq(rulings.disputeId, disputeId));
  return row ?? null;
}

function conflict(current: RulingView | null): AppError {
  const who = current?.reviewerName ? ` by ${current.reviewerName}` : "";
  const what = current ? `: "${current.className}" (${current.reason})` : "";
  return new AppError("conflict:already_ruled", `This dispute was already ruled${who}${what}. Your ruling was not saved.`, { ruling: current });
}

/**
 * A Ruling: the dispute row is locked, so of two reviewers ruling at once exactly one wins; the other gets
 * a conflict carrying the ruling that stands. The ruling becomes the item's final label and is audit-logged.
 */
export async function issueRuling({ projectId, disputeId, reviewerId, classId, reason }: { projectId: number; disputeId: number; reviewerId: string; classId: number; reason: string }) {
  try {
    return await db.transaction(async (tx) => {
      const [dispute] = await tx.select().from(disputes).where(and(eq(disputes.id, disputeId), eq(disputes.projectId, projectId))).for("update");
      if (!dispute) throw new AppError("not_found:dispute", "No such dispute in this project.");
      if (dispute.status !== "open") throw conflict(await getRulingByDisputeId(tx, disputeId));
      const [cls] = await tx.select({ id: labelClasses.id, name: labelClasses.name }).from(labelClasses).where(and(eq(labelClasses.id, classId), eq(labelClasses.projectId, projectId)));
      if (!cls) throw new AppError("bad_request:class", "classId: not a label class of this project.");
      const [item] = await tx.select().from(items).where(eq(items.id, dispute.itemId)).for("update");
      const [ruling] = await tx.insert(rulings).values({ disputeId, reviewerId, classId, reason }).returning();
      const now = new Date();
      await tx.update(disputes).set({ status: "ruled", closedAt: now }).where(eq(disputes.id, disputeId));
      await tx.update(items).set({ finalClassId: classId, finalSource: "ruling", status: "ruled", decidedAt: now }).where(eq(items.id, dispute.itemId));
      await markKnnChanged(tx, projectId, [dispute.itemId]);
      await writeAudit(tx, {
        actorId: reviewerId,
        projectId,
        action: "dispute.ruling",
        targetType: "item",
        targetId: dispute.itemId,
        before: { disputeId, reason: dispute.reason, status: item.status, finalClassId: item.finalClassId, finalSource: item.finalSource },
        after: { disputeId, rulingId: ruling.id, finalClassId: classId, className: cls.name, reason },
      });
      return ruling;
    });
  } catch (error) {
    if (isUniqueViolation(error)) throw conflict(await getRulingByDisputeId(db, disputeId));
    throw error;
  }
}
