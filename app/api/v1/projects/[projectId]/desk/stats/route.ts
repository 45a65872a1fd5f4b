import { getDeskStatsByUserId } from "@/db/queries/desk";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { UNDO_WINDOW_SECONDS } from "@/lib/labelling/constants";
import { statsQuerySchema } from "./schema";

type P = { projectId: string };

/** Desk counters: done today (by the caller), remaining in the project and for the caller. */
export const GET = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "annotator");
  const q = statsQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const stats = await getDeskStatsByUserId({ projectId: access.project.id, userId: access.user.id, overlap: access.project.settings.overlap, timeZone: q.tz });
  return json({ data: { ...stats, overlap: access.project.settings.overlap, undoWindowSeconds: UNDO_WINDOW_SECONDS } }, { headers: { "cache-control": "no-store" } });
});
