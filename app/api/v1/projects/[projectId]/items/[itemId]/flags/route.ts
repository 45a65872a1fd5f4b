import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { flagItem } from "@/lib/labelling/flags";
import { flagSchema } from "./schema";

type P = { projectId: string; itemId: string };

/** Skip, or flag as unclear with a comment: the item leaves the caller's queue and their lease is released. */
export const POST = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "annotator");
  const itemId = parseId(params.itemId, "item");
  const body = await readJson(req, flagSchema);
  const flag = await flagItem({ projectId: access.project.id, itemId, userId: access.user.id, kind: body.kind, comment: body.comment || null });
  return json({ data: { id: flag.id, itemId, kind: flag.kind, comment: flag.comment, createdAt: flag.createdAt.toISOString() } }, { status: 201 });
});
