import { requireRole } from "@/lib/auth/authorize";
import { getProjectAgreement } from "@/lib/agreement-server";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { agreementSummaryQuerySchema } from "./schema";
import { toAgreementSummary } from "@/components/dashboard/agreement-summary";

type P = { projectId: string };

/**
 * The dashboard's agreement summary (role ≥ viewer): headline coefficients with their bootstrap 95%
 * intervals and Landis & Koch bands, from the project's cached agreement report (lib/agreement-server).
 */
export const GET = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "viewer");
  agreementSummaryQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const found = await getProjectAgreement({ projectId: access.project.id });
  return json({ data: toAgreementSummary(access.project.id, found) }, { headers: { "cache-control": "no-store" } });
});
