import { z } from "zod";
import { removeMember, setMemberRole } from "@/db/queries/members";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { changeRoleSchema } from "../schema";

type P = { projectId: string; userId: string };
const userIdSchema = z.string().min(1).max(64);

export const PATCH = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  const { role } = await readJson(req, changeRoleSchema);
  const result = await setMemberRole({ projectId: access.project.id, userId: userIdSchema.parse(params.userId), role, actorId: access.user.id });
  return json({ data: result });
});

export const DELETE = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  await removeMember({ projectId: access.project.id, userId: userIdSchema.parse(params.userId), actorId: access.user.id });
  return new Response(null, { status: 204 });
});
