import { revokeInvitation } from "@/db/queries/members";
import { requireRole } from "@/lib/auth/authorize";
import { parseId, route } from "@/lib/http/route";

type P = { projectId: string; invitationId: string };

export const DELETE = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  await revokeInvitation({ projectId: access.project.id, invitationId: parseId(params.invitationId, "invitation"), actorId: access.user.id });
  return new Response(null, { status: 204 });
});
