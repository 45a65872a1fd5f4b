import { countDisputesByProjectId, listDisputePairsByProjectId, listDisputesByProjectId } from "@/db/queries/disputes";
import { requireRole } from "@/lib/auth/authorize";
import { decodeCursor, encodeCursor } from "@/lib/http/cursor";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { disputesQuerySchema } from "./schema";

type P = { projectId: string };

/** Disputes (reviewer+), oldest first, filtered by status, reason, class pair and age; each with its labels and annotators' names. */
export const GET = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "reviewer");
  const { cursor, limit, ...filter } = disputesQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const scope = `disputes:${access.project.id}:${JSON.stringify(filter)}`;
  const after = decodeCursor<{ at: string; id: number }>(scope, cursor ?? null);
  const projectId = access.project.id;
  const [rows, total, pairs] = await Promise.all([
    listDisputesByProjectId({ projectId, filter, after, limit }),
    countDisputesByProjectId({ projectId, filter }),
    listDisputePairsByProjectId({ projectId }),
  ]);
  const last = rows[rows.length - 1];
  return json({ data: rows, total, pairs, next: rows.length === limit && last ? encodeCursor(scope, { at: last.openedAt, id: last.id }) : null });
});
