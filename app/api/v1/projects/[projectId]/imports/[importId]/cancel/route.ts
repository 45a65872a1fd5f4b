import { importView, requestImportCancel } from "@/db/queries/imports";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, route } from "@/lib/http/route";
import { importIdOf } from "@/lib/imports/ids";

export const POST = route<{ projectId: string; importId: string }>(async (_req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  await requireRole(projectId, "owner");
  const row = await requestImportCancel({ projectId, importId: importIdOf(params.importId) });
  return json({ import: importView(row) });
});
