import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route, searchParams } from "@/lib/http/route";
import { buildDeskItem } from "@/lib/labelling/desk-item";
import { leaseNextItem } from "@/lib/labelling/queue";
import { nextBodySchema, nextQuerySchema } from "./schema";

type P = { projectId: string };

async function next(projectId: number, exclude: number[]) {
  const access = await requireRole(projectId, "annotator");
  const s = access.project.settings;
  const lease = await leaseNextItem({ projectId: access.project.id, userId: access.user.id, overlap: s.overlap, queueOrder: s.queueOrder, controlRate: s.controlRate, exclude });
  if (!lease) return json({ data: null });
  const item = await buildDeskItem({ projectId: access.project.id, itemId: lease.itemId, userId: access.user.id, leasedUntil: lease.leasedUntil });
  return json({ data: item }, { headers: { "cache-control": "no-store" } });
}

/** The caller's next Desk item, leased to them: an item they already hold first, else a new lease. */
export const GET = route<P>(async (req, { params }) => {
  const q = nextQuerySchema.parse(Object.fromEntries(searchParams(req)));
  return next(parseId(params.projectId, "project"), q.exclude ?? []);
});

export const POST = route<P>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const body = await readJson(req, nextBodySchema);
  return next(projectId, body.exclude);
});
