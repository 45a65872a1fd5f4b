import "server-only";
import type { Pool } from "pg";
import { named, pgTransaction, pool, type PgTx } from "@/db";
import type { Label, SuggestionSnapshot } from "@/db/schema";
import { AppError } from "@/lib/errors";
import type { ProjectSettings } from "@/lib/projects/settings";
import { decideConsensus } from "./consensus";
import { isUniqueViolation, pgConstraint } from "./pg-errors";

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
/**
 * `poolRankDue`: whether this label may have brought the project's label events since the last pool re-ranking to the
 * threshold (read before this commit counts itself, so with concurrent labels the re-ranking can come one label late,
 * never not at all); null for a replay.
 */
export type LabelResult = { label: Label; replayed: boolean; outcome: LabelOutcome; disputeId: number | null; poolRankDue: boolean | null };

/** Locks the item row. (Anything that must see writes committed while this waited for the lock is read in a later statement.) */
async function lockItem(client: PgTx, input: LabelInput) {
  const res = await named<{ id: number; is_control: boolean; final_class_id: number | null; status: string }>(
    client,
    "vicinal_label_lock_item",
    "select i.id, i.is_control, i.final_class_id, i.status::text as status from items i where i.id = $1 and i.project_id = $2 for update of i",
    [input.itemId, input.projectId],
  );
  const row = res.rows[0];
  if (!row) throw new AppError("not_found:item", "No such item in this project.");
  return { id: Number(row.id), isControl: row.is_control, finalClassId: row.final_class_id, status: row.status };
}

type LabelRow = { id: string; project_id: number; item_id: number; annotator_id: string; class_id: number; suggestion: SuggestionSnapshot | null; took_suggestion: boolean; client_submission_id: string; created_at: Date; undone_at: Date | null };
const labelColumns = "id, project_id, item_id, annotator_id, class_id, suggestion, took_suggestion, client_submission_id, created_at, undone_at";
const labelOf = (r: LabelRow): Label => ({
  id: Number(r.id),
  projectId: r.project_id,
  itemId: r.item_id,
  annotatorId: r.annotator_id,
  classId: r.class_id,
  suggestion: r.suggestion,
  tookSuggestion: r.took_suggestion,
  clientSubmissionId: r.client_submission_id,
  createdAt: r.created_at,
  undoneAt: r.undone_at,
});

async function findSubmission(client: Pool | PgTx, userId: string, clientSubmissionId: string) {
  const res = await named<LabelRow>(client, "vicinal_label_find_submission", `select ${labelColumns} from labels where annotator_id = $1 and client_submission_id = $2`, [userId, clientSubmissionId]);
  return res.rows[0] ? labelOf(res.rows[0]) : null;
}

function replay(existing: Label, itemId: number): LabelResult {
  if (existing.itemId !== itemId) {
    throw new AppError("conflict:submission_reused", "clientSubmissionId: this id was already used for a label on another item; generate a new one per submission.");
  }
  return { label: existing, replayed: true, outcome: "pending", disputeId: null, poolRankDue: null };
}

/**
 * One label in one transaction: the item row is locked, the label inserted, the annotator's lease released,
 * label_count updated and, at `overlap` live labels, the consensus applied (final label or an open dispute); the item
 * is logged in knn_changes (the same write markKnnChanged makes), which gives the project a new version at commit.
 * A retried submission (same annotator + clientSubmissionId) returns the stored label instead of a second one.
 */
export async function submitLabel(input: LabelInput): Promise<LabelResult> {
  try {
    return await pgTransaction((client) => submitInTx(client, input));
  } catch (error) {
    // Two retries of one submission racing on different items: the unique index decides; answer like a replay.
    if (isUniqueViolation(error) && pgConstraint(error) === "labels_annotator_submission_idx") {
      const existing = await findSubmission(pool, input.userId, input.clientSubmissionId);
      if (existing) return replay(existing, input.itemId);
    }
    if (isUniqueViolation(error) && pgConstraint(error) === "labels_item_annotator_live_idx") {
      throw new AppError("conflict:already_labelled", "You have already labelled this item.");
    }
    throw error;
  }
}

async function submitInTx(client: PgTx, input: LabelInput): Promise<LabelResult> {
  const item = await lockItem(client, input);
  // One statement, after the lock, for every check: a retry of this submission, the class, this annotator's live label,
  // the live labels' classes, others' leases, an open dispute.
  const state = await named<{ replayed: boolean; class_ok: boolean; mine: boolean; live: number[]; others_leases: number; open_dispute: boolean }>(
    client,
    "vicinal_label_state",
    `select
      exists (select 1 from labels l where l.annotator_id = $3 and l.client_submission_id = $5) as replayed,
      exists (select 1 from label_classes c where c.id = $4 and c.project_id = $2) as class_ok,
      exists (select 1 from labels l where l.item_id = $1 and l.annotator_id = $3 and l.undone_at is null) as mine,
      array(select l.class_id from labels l where l.item_id = $1 and l.undone_at is null) as live,
      (select count(*)::int from assignments a where a.item_id = $1 and a.user_id <> $3 and a.leased_until > now()) as others_leases,
      exists (select 1 from disputes d where d.item_id = $1 and d.status = 'open') as open_dispute`,
    [item.id, input.projectId, input.userId, input.classId, input.clientSubmissionId],
  );
  const s = state.rows[0];
  if (s.replayed) {
    const existing = await findSubmission(client, input.userId, input.clientSubmissionId);
    if (existing) return replay(existing, input.itemId);
  }
  if (!s.class_ok) throw new AppError("bad_request:class", "classId: not a label class of this project.");
  if (s.mine) throw new AppError("conflict:already_labelled", "You have already labelled this item.");
  if (!item.isControl) {
    if (item.finalClassId != null || s.open_dispute || !["unlabelled", "in_progress"].includes(item.status)) {
      throw new AppError("conflict:item_closed", "This item no longer takes labels: it has a final label or waits in Disputes.");
    }
    if (s.live.length + s.others_leases >= input.settings.overlap) {
      throw new AppError("conflict:item_full", "This item already has all the labels it needs (or they are reserved by other annotators). Take the next item.");
    }
  }

  const snapshot = input.snapshot;
  if (input.via === "take" && (!snapshot?.shown || snapshot.topClassId !== input.classId)) {
    throw new AppError("bad_request:take", "via: \"take\" needs the shown suggestion's top class as classId.");
  }
  const inserted = await named<LabelRow>(
    client,
    "vicinal_label_insert",
    `insert into labels (project_id, item_id, annotator_id, class_id, suggestion, took_suggestion, client_submission_id)
     values ($1, $2, $3, $4, $5::jsonb, $6, $7) returning ${labelColumns}`,
    [input.projectId, item.id, input.userId, input.classId, snapshot === null ? null : JSON.stringify(snapshot), input.via === "take", input.clientSubmissionId],
  );
  const label = labelOf(inserted.rows[0]);

  const live = [...s.live.map(Number), input.classId];
  let outcome: LabelOutcome = item.isControl ? "control" : "pending";
  let disputeId: number | null = null;
  let status: string | null = null;
  let final: { classId: number; source: string } | null = null;
  if (!item.isControl) {
    const c = decideConsensus(live, input.settings.overlap);
    if (c.kind === "pending") status = "in_progress";
    else if (c.kind === "final") {
      status = "agreed";
      final = { classId: c.classId, source: c.source };
      outcome = c.source;
    } else {
      status = "disputed";
      const d = await named<{ id: number }>(client, "vicinal_label_open_dispute", "insert into disputes (project_id, item_id, reason) values ($1, $2, 'disagreement') returning id", [input.projectId, item.id]);
      disputeId = Number(d.rows[0].id);
      outcome = "disputed";
    }
  }
  // The annotator's lease released, the item's count/status/final label set and its vote logged in knn_changes (which
  // gives the project a new version at commit, as markKnnChanged does), in one statement.
  const applied = await named<{ since_pool_rank: number | null }>(
    client,
    "vicinal_label_apply",
    `with released as (delete from assignments where item_id = $1 and user_id = $2),
       changed as (insert into knn_changes (project_id, item_id) values ($3, $1))
     update items set label_count = $4,
       status = coalesce($5::item_status, status),
       final_class_id = case when $6::boolean then $7::int else final_class_id end,
       final_source = case when $6::boolean then $8::label_source else final_source end,
       decided_at = case when $6::boolean then now() else decided_at end
     where id = $1
     returning (select ks.labels_since_pool_rank from knn_state ks where ks.project_id = $3) as since_pool_rank`,
    [item.id, input.userId, input.projectId, live.length, status, final !== null, final?.classId ?? null, final?.source ?? null],
  );
  const since = applied.rows[0]?.since_pool_rank ?? 0;
  return { label, replayed: false, outcome, disputeId, poolRankDue: since + 1 >= input.settings.poolRerankEvery };
}
