import { inviteMember, listMembersByProjectId, listOpenInvitationsByProjectId } from "@/db/queries/members";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { inviteSchema } from "./schema";

type P = { projectId: string };

/** Members and open invitations (owners see e-mails; other members see names and roles). */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "viewer");
  const members = await listMembersByProjectId({ projectId: access.project.id });
  const isOwner = access.isAdmin || access.role === "owner";
  return json({
    data: members.map((m) => ({ userId: m.userId, name: m.name, role: m.role, since: m.since, email: isOwner ? m.email : undefined, deactivated: Boolean(m.deactivatedAt) })),
    invitations: isOwner ? await listOpenInvitationsByProjectId({ projectId: access.project.id }) : [],
  });
});

/** Invite by e-mail with a role; the e-mail goes out through the job queue. */
export const POST = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  const input = await readJson(req, inviteSchema);
  const invitation = await inviteMember({ projectId: access.project.id, email: input.email, role: input.role, actor: { id: access.user.id, name: access.user.name, email: access.user.email } });
  return json({ data: invitation }, { status: 201 });
});
