import { createProject, listProjectsByUserId } from "@/db/queries/projects";
import { requireUser } from "@/lib/auth/authorize";
import { decodeCursor, encodeCursor } from "@/lib/http/cursor";
import { json, readJson, route, searchParams } from "@/lib/http/route";
import { createProjectSchema, listQuerySchema } from "./schema";

/** Projects the caller belongs to (all, for site admins), paged by cursor. */
export const GET = route(async (req) => {
  const caller = await requireUser();
  const q = listQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const after = decodeCursor<{ id: number }>(`projects:${caller.user.id}`, q.cursor ?? null);
  const all = await listProjectsByUserId({ userId: caller.user.id, isAdmin: caller.user.isAdmin });
  const sorted = all.sort((a, b) => a.id - b.id).filter((p) => !after || p.id > after.id);
  const page = sorted.slice(0, q.limit);
  const next = sorted.length > q.limit ? encodeCursor(`projects:${caller.user.id}`, { id: page[page.length - 1].id }) : null;
  return json({ data: page, nextCursor: next });
});

/** Any signed-in user may create a project and becomes its owner. */
export const POST = route(async (req) => {
  const caller = await requireUser();
  const input = await readJson(req, createProjectSchema);
  const project = await createProject({ ownerId: caller.user.id, ...input });
  return json({ data: project }, { status: 201 });
});
