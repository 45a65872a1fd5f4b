import "server-only";
import { and, eq, isNull, sql } from "drizzle-orm";
import { db, type DbOrTx, type Tx } from "@/db";
import { disputes, items, labelClasses, labels, type Label, type SuggestionSnapshot } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { ProjectSettings } from "@/lib/projects/settings";
import { bumpKnnVersion } from "@/lib/suggest";
import { decideConsensus } from "./consensus";
import { isUniqueViolation, pgConstraint } from "./pg-errors";
import { releaseLease } from "./queue";

export type LabelInput = {
  projectId: number;
  settings: ProjectSettings;
  itemId: number;
  userId: string;
  classId: number;
  clientSubmissionId: string;
  via: "take" | "choose";
  /** What the Desk showed (verified), or for blind items the hidden suggestion with shown = false. */
  snapshot: SuggestionSnapshot | null;
};

export type LabelOutcome = "pending" | "agreed" | "single" | "disputed" | "control";
export type LabelResult = { label: Label; replayed: boolean; outcome: LabelOutcome; disputeId: number | null };

async function lockItem(tx: Tx, projectId: number, itemId: number) {
  const [item] = await tx.select().from(items).where(and(eq(items.id, itemId), eq(items.projectId, projectId))).for("update");
  if (!item) throw new AppError("not_found:item", "No such item in this project.");
  return item;
}

async function findSubmission(tx: DbOrTx, userId: string, clientSubmissionId: string) {
  const [row] = await tx.select().from(labels).where(and(eq(labels.annotatorId, userId), eq(labels.clientSubmissionId, clientSubmissionId)));
  return row ?? null;
}

function replay(existing: Label, itemId: number): LabelResult {
  if (existing.itemId !== itemId) {
    throw new AppError("conflict:submission_reused", "clientSubmissionId: this id was already used for a label on another item; generate a new one per submission.");
  }
  return { label: existing, replayed: true, outcome: "pending", disputeId: null };
}

/**
 * One label in one transaction: the item row is locked, the label inserted, the annotator's lease released,
 * label_count updated and, at `overlap` live labels, the consensus applied (final label or an open dispute).
 * A retried submission (same annotator + clientSubmissionId) returns the stored label instead of a second one.
 */
export async function submitLabel(input: LabelInput): Promise<LabelResult> {
  try {
    return await db.transaction((tx) => submitInTx(tx, input));
  } catch (error) {
    // Two retries of one submission racing on different items: the unique index decides; answer like a replay.
    if (isUniqueViolation(error) && pgConstraint(error) === "labels_annotator_submission_idx") {
      const existing = await findSubmission(db, input.userId, input.clientSubmissionId);
      if (existing) return replay(existing, input.itemId);
    }
    if (isUniqueViolation(error) && pgConstraint(error) === "labels_item_annotator_live_idx") {
      throw new AppError("conflict:already_labelled", "You have already labelled this item.");
    }
    throw error;
  }
}

async function submitInTx(tx: Tx, input: LabelInput): Promise<LabelResult> {
  const item = await lockItem(tx, input.projectId, input.itemId);
  const existing = await findSubmission(tx, input.userId, input.clientSubmissionId);
  if (existing) return replay(existing, input.itemId);

  const [cls] = await tx.select({ id: labelClasses.id }).from(labelClasses).where(and(eq(labelClasses.id, input.classId), eq(labelClasses.projectId, input.projectId)));
  if (!cls) throw new AppError("bad_request:class", "classId: not a label class of this project.");

  const state = await tx.execute<{ mine: boolean; live: number; others_leases: number; open_dispute: boolean }>(sql`
    select
      exists (select 1 from labels l where l.item_id = ${item.id} and l.annotator_id = ${input.userId} and l.undone_at is null) as mine,
      (select count(*)::int from labels l where l.item_id = ${item.id} and l.undone_at is null) as live,
      (select count(*)::int from assignments a where a.item_id = ${item.id} and a.user_id <> ${input.userId} and a.leased_until > now()) as others_leases,
      exists (select 1 from disputes d where d.item_id = ${item.id} and d.status = 'open') as open_dispute`);
  const s = state.rows[0];
  if (s.mine) throw new AppError("conflict:already_labelled", "You have already labelled this item.");
  if (!item.isControl) {
    if (item.finalClassId != null || s.open_dispute || !["unlabelled", "in_progress"].includes(item.status)) {
      throw new AppError("conflict:item_closed", "This item no longer takes labels: it has a final label or waits in Disputes.");
    }
    if (s.live + s.others_leases >= input.settings.overlap) {
      throw new AppError("conflict:item_full", "This item already has all the labels it needs (or they are reserved by other annotators). Take the next item.");
    }
  }

  const snapshot = input.snapshot;
  if (input.via === "take" && (!snapshot?.shown || snapshot.topClassId !== input.classId)) {
    throw new AppError("bad_request:take", "via: \"take\" needs the shown suggestion's top class as classId.");
  }
  const [label] = await tx
    .insert(labels)
    .values({
      projectId: input.projectId,
      itemId: item.id,
      annotatorId: input.userId,
      classId: input.classId,
      suggestion: snapshot,
      tookSuggestion: input.via === "take",
      clientSubmissionId: input.clientSubmissionId,
    })
    .returning();
  await releaseLease(tx, item.id, input.userId);

  const live = await tx.select({ classId: labels.classId }).from(labels).where(and(eq(labels.itemId, item.id), isNull(labels.undoneAt)));
  let outcome: LabelOutcome = item.isControl ? "control" : "pending";
  let disputeId: number | null = null;
  const patch: Partial<typeof items.$inferInsert> = { labelCount: live.length };
  if (!item.isControl) {
    const c = decideConsensus(live.map((l) => l.classId), input.settings.overlap);
    if (c.kind === "pending") patch.status = "in_progress";
    else if (c.kind === "final") {
      Object.assign(patch, { status: "agreed", finalClassId: c.classId, finalSource: c.source, decidedAt: new Date() });
      outcome = c.source;
    } else {
      patch.status = "disputed";
      const [d] = await tx.insert(disputes).values({ projectId: input.projectId, itemId: item.id, reason: "disagreement" }).returning({ id: disputes.id });
      disputeId = d.id;
      outcome = "disputed";
    }
  }
  await tx.update(items).set(patch).where(eq(items.id, item.id));
  await bumpKnnVersion(tx, input.projectId);
  return { label, replayed: false, outcome, disputeId };
}
