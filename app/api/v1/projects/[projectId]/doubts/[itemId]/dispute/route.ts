import { openDoubtDisputeByItemId } from "@/db/queries/suggest";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { sendToDisputesSchema } from "./schema";

type P = { projectId: string; itemId: string };

/** Sends a doubted item to Disputes (owner): an open dispute with reason "doubt"; 409 when one is already open. */
export const POST = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  const itemId = parseId(params.itemId, "item");
  const input = await readJson(req, sendToDisputesSchema);
  const dispute = await openDoubtDisputeByItemId({ projectId: access.project.id, itemId, userId: access.user.id, note: input.note });
  return json({ data: { disputeId: dispute.id, itemId, status: dispute.status, reason: dispute.reason } }, { status: 201 });
});
