import { listAudit } from "@/db/queries/users";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { projectAuditQuerySchema } from "./schema";

type P = { projectId: string };

/** The project's part of the audit trail (owners). */
export const GET = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  const q = projectAuditQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const rows = await listAudit({ projectId: access.project.id, ...q });
  return json({ data: rows, nextBefore: rows.length === q.limit ? rows[rows.length - 1].id : null });
});
