import { getEditionById } from "@/db/queries/editions";
import { requireRole } from "@/lib/auth/authorize";
import { diffCsvLink, diffEditions } from "@/lib/editions/service";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { diffQuerySchema } from "./schema";

/** What changed from edition `against` to this one; `format=csv` answers a download link of the full list. */
export const GET = route<{ projectId: string; editionId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const access = await requireRole(projectId, "viewer");
  const q = diffQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const to = await getEditionById({ projectId, editionId: parseId(params.editionId, "edition") });
  const from = await getEditionById({ projectId, editionId: parseId(q.against, "edition") });
  if (q.format === "csv") return json(await diffCsvLink({ projectId, projectName: access.project.name, from, to }), { headers: { "cache-control": "no-store" } });
  return json({ data: await diffEditions({ from, to, limit: q.limit }) }, { headers: { "cache-control": "no-store" } });
});
