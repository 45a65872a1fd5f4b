import { listAudit } from "@/db/queries/users";
import { requireAdmin } from "@/lib/auth/authorize";
import { json, route, searchParams } from "@/lib/http/route";
import { adminAuditQuerySchema } from "./schema";

export const GET = route(async (req) => {
  await requireAdmin();
  const q = adminAuditQuerySchema.parse(Object.fromEntries(searchParams(req)));
  const rows = await listAudit(q);
  return json({ data: rows, nextBefore: rows.length === q.limit ? rows[rows.length - 1].id : null });
});
