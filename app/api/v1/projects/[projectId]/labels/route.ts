import { listLabelsSinceByProjectId } from "@/db/queries/desk";
import { requireRole } from "@/lib/auth/authorize";
import { roleAtLeast } from "@/lib/auth/roles";
import { decodeCursor, encodeCursor } from "@/lib/http/cursor";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { SYNC_SETTLE_SECONDS } from "@/lib/labelling/constants";
import { labelsQuerySchema } from "./schema";

type P = { projectId: string };

/**
 * Incremental sync of settled labels (viewer+). Keep the returned `next` cursor and pass it as `since`
 * to get only what was added after. Annotator names come only to reviewers and owners; others see a pseudonym.
 */
export const GET = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "viewer");
  const q = labelsQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const scope = `labels:${access.project.id}`;
  const cursor = decodeCursor<{ after: number }>(scope, q.since ?? null);
  const afterId = cursor?.after ?? 0;
  const withNames = access.isAdmin || roleAtLeast(access.role, "reviewer");
  const rows = await listLabelsSinceByProjectId({ projectId: access.project.id, afterId, limit: q.limit, withNames });
  const last = rows.length ? rows[rows.length - 1].id : afterId;
  return json({ data: rows, next: encodeCursor(scope, { after: last }), more: rows.length === q.limit, settleSeconds: SYNC_SETTLE_SECONDS });
});
