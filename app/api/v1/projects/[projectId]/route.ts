import { listClassesByProjectId, updateProjectSettings } from "@/db/queries/projects";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { updateProjectSchema } from "./schema";

type P = { projectId: string };

export const GET = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "viewer");
  const classes = await listClassesByProjectId({ projectId: access.project.id });
  const p = access.project;
  return json({ data: { id: p.id, name: p.name, description: p.description, settings: p.settings, featureSchema: p.featureSchema, createdAt: p.createdAt, classes, role: access.isAdmin && !access.role ? "owner" : access.role } });
});

export const PATCH = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  const input = await readJson(req, updateProjectSchema);
  const updated = await updateProjectSettings({ projectId: access.project.id, actorId: access.user.id, ...input });
  return json({ data: updated });
});
