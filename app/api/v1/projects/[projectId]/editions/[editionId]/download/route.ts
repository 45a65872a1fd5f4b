import { getEditionById } from "@/db/queries/editions";
import { requireRole } from "@/lib/auth/authorize";
import { editionDownloadLink } from "@/lib/editions/service";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { downloadQuerySchema } from "./schema";

/** A short-lived presigned GET URL for one file of a published edition. */
export const GET = route<{ projectId: string; editionId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const access = await requireRole(projectId, "viewer");
  const q = downloadQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const edition = await getEditionById({ projectId, editionId: parseId(params.editionId, "edition") });
  const link = await editionDownloadLink(edition, access.project.name, q.format);
  return json(link, { headers: { "cache-control": "no-store" } });
});
