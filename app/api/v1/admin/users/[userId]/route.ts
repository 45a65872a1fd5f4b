import { z } from "zod";
import { removeMember, setMemberRole } from "@/db/queries/members";
import { updateUserByAdmin } from "@/db/queries/users";
import { requireAdmin } from "@/lib/auth/authorize";
import { json, readJson, route } from "@/lib/http/route";
import { adminUserPatchSchema } from "./schema";

type P = { userId: string };

/** Site admins: grant or revoke admin, deactivate, and assign a role in any project (null removes). */
export const PATCH = route<P>(async (req, { params }) => {
  const caller = await requireAdmin();
  const userId = z.string().min(1).max(64).parse(params.userId);
  const input = await readJson(req, adminUserPatchSchema);
  if (input.isAdmin !== undefined || input.deactivated !== undefined) {
    await updateUserByAdmin({ userId, actorId: caller.user.id, isAdmin: input.isAdmin, deactivated: input.deactivated });
  }
  if (input.membership) {
    const { projectId, role } = input.membership;
    if (role) await setMemberRole({ projectId, userId, role, actorId: caller.user.id });
    else await removeMember({ projectId, userId, actorId: caller.user.id });
  }
  return json({ data: { ok: true } });
});
