import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { afterLabelCommitted } from "@/lib/labelling/after-commit";
import { UNDO_WINDOW_SECONDS } from "@/lib/labelling/constants";
import { blindSnapshotFor, getItemInProject } from "@/lib/labelling/desk-item";
import { submitLabel } from "@/lib/labelling/label";
import { readSnapshot } from "@/lib/labelling/snapshot";
import { undoLabel } from "@/lib/labelling/undo";
import type { SuggestionSnapshot } from "@/db/schema";
import { labelSchema } from "./schema";

type P = { projectId: string; itemId: string };

const view = (l: { id: number; itemId: number; classId: number; tookSuggestion: boolean; createdAt: Date; undoneAt: Date | null }) => ({
  id: l.id,
  itemId: l.itemId,
  classId: l.classId,
  tookSuggestion: l.tookSuggestion,
  createdAt: l.createdAt.toISOString(),
  undoneAt: l.undoneAt ? l.undoneAt.toISOString() : null,
  undoUntil: new Date(l.createdAt.getTime() + UNDO_WINDOW_SECONDS * 1000).toISOString(),
});

/**
 * What the Desk showed for this label. A valid token for a shown suggestion settles it at once: tokens with shown
 * suggestions are only signed for items that are not blind, and an item's blind flag never changes after its import
 * (the label transaction still checks that the item is in the project). Otherwise the item is read: 404 when it is not
 * in the project, the hidden suggestion for a blind item (whatever token came), else the token's snapshot or its error.
 */
async function snapshotFor(projectId: number, itemId: number, userId: string, token: string | null | undefined) {
  let fromToken: SuggestionSnapshot | null = null;
  let tokenError: unknown = null;
  try {
    fromToken = readSnapshot(token, itemId, userId);
  } catch (error) {
    tokenError = error;
  }
  if (fromToken?.shown) return fromToken;
  const item = await getItemInProject(projectId, itemId);
  if (!item) throw new AppError("not_found:item", "No such item in this project.");
  if (item.isBlind) return blindSnapshotFor(projectId, itemId);
  if (tokenError) throw tokenError;
  return fromToken;
}

/** Stores the caller's label; a retry with the same clientSubmissionId answers 200 with the same label. */
export const POST = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "annotator");
  const itemId = parseId(params.itemId, "item");
  const body = await readJson(req, labelSchema);
  const snapshot = await snapshotFor(access.project.id, itemId, access.user.id, body.suggestionToken);
  const result = await submitLabel({
    projectId: access.project.id,
    settings: access.project.settings,
    itemId,
    userId: access.user.id,
    classId: body.classId,
    clientSubmissionId: body.clientSubmissionId,
    via: body.via,
    snapshot,
  });
  if (!result.replayed) await afterLabelCommitted({ projectId: access.project.id, settings: access.project.settings, openedDispute: result.disputeId != null, poolRankDue: result.poolRankDue });
  return json({ data: { label: view(result.label), replayed: result.replayed } }, { status: result.replayed ? 200 : 201 });
});

/** Undoes the caller's own label on this item, within the undo window; the item is leased back to them. */
export const DELETE = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "annotator");
  const itemId = parseId(params.itemId, "item");
  const undone = await undoLabel({ projectId: access.project.id, itemId, userId: access.user.id });
  await afterLabelCommitted({ projectId: access.project.id, settings: access.project.settings, openedDispute: false });
  return json({ data: { label: view(undone) } });
});
