import { getDashboardByProjectId } from "@/db/queries/dashboard";
import { namesVisibleTo } from "@/lib/agreement-server";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { dashboardQuerySchema } from "./schema";

type P = { projectId: string };

/**
 * The project dashboard (role ≥ viewer): progress by status, class balance of final labels, labels per
 * annotator per day, suggestion use by class, open disputes by age. Agreement is at …/dashboard/agreement.
 * Annotator names only for owners, reviewers and site admins; everyone else sees "Annotator 1, 2, …".
 */
export const GET = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "viewer");
  const q = dashboardQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const data = await getDashboardByProjectId({
    projectId: access.project.id,
    userId: access.user.id,
    days: q.days,
    timeZone: q.tz,
    namesVisible: namesVisibleTo(access.role, access.isAdmin),
  });
  return json({ data }, { headers: { "cache-control": "no-store" } });
});
