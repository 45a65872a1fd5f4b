import { z } from "zod";
import { listAudit } from "@/db/queries/users";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, route, searchParams } from "@/lib/http/route";

type P = { projectId: string };
const querySchema = z.object({ action: z.string().max(60).optional(), before: z.coerce.number().int().positive().optional(), limit: z.coerce.number().int().min(1).max(500).default(100) });

/** The project's part of the audit trail (owners). */
export const GET = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  const q = querySchema.parse(Object.fromEntries(searchParams(req)));
  const rows = await listAudit({ projectId: access.project.id, ...q });
  return json({ data: rows, nextBefore: rows.length === q.limit ? rows[rows.length - 1].id : null });
});
