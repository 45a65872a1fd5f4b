import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { afterLabelCommitted } from "@/lib/labelling/after-commit";
import { UNDO_WINDOW_SECONDS } from "@/lib/labelling/constants";
import { blindSnapshotFor, getItemInProject } from "@/lib/labelling/desk-item";
import { submitLabel } from "@/lib/labelling/label";
import { readSnapshot } from "@/lib/labelling/snapshot";
import { undoLabel } from "@/lib/labelling/undo";
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

/** Stores the caller's label; a retry with the same clientSubmissionId answers 200 with the same label. */
export const POST = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "annotator");
  const itemId = parseId(params.itemId, "item");
  const body = await readJson(req, labelSchema);
  const item = await getItemInProject(access.project.id, itemId);
  if (!item) throw new AppError("not_found:item", "No such item in this project.");
  const snapshot = item.isBlind ? await blindSnapshotFor(access.project.id, itemId) : readSnapshot(body.suggestionToken, itemId, access.user.id);
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
  if (!result.replayed) await afterLabelCommitted({ projectId: access.project.id, settings: access.project.settings, openedDispute: result.disputeId != null });
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
