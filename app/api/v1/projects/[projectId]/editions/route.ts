import { listEditionsByProjectId } from "@/db/queries/editions";
import { requireRole } from "@/lib/auth/authorize";
import { createEdition } from "@/lib/editions/actions";
import { editionSummary } from "@/lib/editions/view";
import { decodeCursor, encodeCursor } from "@/lib/http/cursor";
import { json, parseId, readJson, route, searchParams } from "@/lib/http/route";
import { createEditionSchema, listEditionsQuerySchema } from "./schema";

/** The project's editions, newest first, paged by cursor. */
export const GET = route<{ projectId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  await requireRole(projectId, "viewer");
  const q = listEditionsQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const scope = `editions:${projectId}`;
  const after = decodeCursor<{ n: number }>(scope, q.cursor ?? null);
  const rows = await listEditionsByProjectId({ projectId, beforeNumber: after?.n ?? null, limit: q.limit + 1 });
  const page = rows.slice(0, q.limit);
  const nextCursor = rows.length > q.limit ? encodeCursor(scope, { n: page[page.length - 1].number }) : null;
  return json({ data: page.map(editionSummary), nextCursor }, { headers: { "cache-control": "no-store" } });
});

/** Publishes the next edition: a pending row now, the files from the background job. */
export const POST = route<{ projectId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const access = await requireRole(projectId, "owner");
  const options = await readJson(req, createEditionSchema, 10_000);
  const edition = await createEdition({ projectId, userId: access.user.id, options });
  return json({ data: editionSummary(edition) }, { status: 202 });
});
