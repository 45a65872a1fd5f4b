import { getFreshReportByProjectId, listClassBriefsByProjectId, toReportView } from "@/db/queries/suggest";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { MAP_INLINE_MAX } from "@/lib/suggest/map";
import { mapQuerySchema } from "./schema";

type P = { projectId: string };

export const dynamic = "force-dynamic";

/** The Map (viewer and up): the latest PCA picture for the current votes, recomputed when stale. */
export const GET = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "viewer");
  mapQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const projectId = access.project.id;
  const [{ report, version }, classes] = await Promise.all([
    getFreshReportByProjectId({ projectId, kind: "map", userId: access.user.id, inlineMax: MAP_INLINE_MAX }),
    listClassBriefsByProjectId({ projectId }),
  ]);
  return json({ data: { report: toReportView(report), version, classes } });
});
