import { getDisputeById, listFlagsByItemId } from "@/db/queries/disputes";
import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, route } from "@/lib/http/route";
import { getItemInProject, itemImageUrl, safeSuggestion } from "@/lib/labelling/desk-item";
import { getRulingByDisputeId } from "@/lib/labelling/ruling";
import { db } from "@/db";

type P = { projectId: string; disputeId: string };

/** One dispute for a reviewer: the item, every annotator's label (with names), flags, the live suggestion and neighbours, any ruling. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "reviewer");
  const dispute = await getDisputeById({ projectId: access.project.id, disputeId: parseId(params.disputeId, "dispute") });
  if (!dispute) throw new AppError("not_found:dispute", "No such dispute in this project.");
  const item = await getItemInProject(access.project.id, dispute.itemId);
  if (!item) throw new AppError("not_found:item", "No such item in this project.");
  const [flags, suggestion, ruling, imageUrl] = await Promise.all([
    listFlagsByItemId({ itemId: item.id }),
    safeSuggestion(access.project.id, item.id),
    getRulingByDisputeId(db, dispute.id),
    itemImageUrl(item),
  ]);
  return json({
    data: {
      dispute,
      item: { id: item.id, externalId: item.externalId, fields: item.fields, imageUrl, isControl: item.isControl, isBlind: item.isBlind },
      flags,
      suggestion,
      ruling,
    },
  });
});
