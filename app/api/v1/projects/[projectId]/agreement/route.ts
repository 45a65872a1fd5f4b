import { requireRole } from "@/lib/auth/authorize";
import { getAgreementView } from "@/lib/agreement-server";
import { json, parseId, route } from "@/lib/http/route";

type P = { projectId: string };

/**
 * The project's agreement report (role ≥ viewer). Cached per knn_state version; recomputed inline for
 * projects under 200 000 live labels, otherwise queued, answering with the last report and `stale: true`.
 * Annotator names only for owners and reviewers.
 */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "viewer");
  const data = await getAgreementView({ projectId: access.project.id, userId: access.user.id, role: access.role, isAdmin: access.isAdmin });
  return json({ data }, { headers: { "cache-control": "no-store" } });
});
