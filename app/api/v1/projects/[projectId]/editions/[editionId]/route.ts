import { getEditionById } from "@/db/queries/editions";
import { requireAdmin, requireRole } from "@/lib/auth/authorize";
import { removeEdition } from "@/lib/editions/actions";
import { editionDetail } from "@/lib/editions/view";
import { json, parseId, route } from "@/lib/http/route";
import { editionParamsSchema } from "./schema";

/** One edition with its manifest. */
export const GET = route<{ projectId: string; editionId: string }>(async (_req, { params }) => {
  const p = editionParamsSchema.parse(params);
  const projectId = parseId(p.projectId, "project");
  await requireRole(projectId, "viewer");
  const edition = await getEditionById({ projectId, editionId: parseId(p.editionId, "edition") });
  return json({ data: editionDetail(edition) }, { headers: { "cache-control": "no-store" } });
});

/** Editions are immutable; only a site admin may delete one (audit-logged, objects removed). */
export const DELETE = route<{ projectId: string; editionId: string }>(async (_req, { params }) => {
  const p = editionParamsSchema.parse(params);
  const caller = await requireAdmin();
  const projectId = parseId(p.projectId, "project");
  await removeEdition({ projectId, editionId: parseId(p.editionId, "edition"), actorId: caller.user.id });
  return new Response(null, { status: 204 });
});
