import { z } from "zod";
import { listAudit } from "@/db/queries/users";
import { requireAdmin } from "@/lib/auth/authorize";
import { json, route, searchParams } from "@/lib/http/route";

const querySchema = z.object({
  projectId: z.coerce.number().int().positive().optional(),
  action: z.string().max(60).optional(),
  actor: z.string().max(120).optional(),
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});

export const GET = route(async (req) => {
  await requireAdmin();
  const q = querySchema.parse(Object.fromEntries(searchParams(req)));
  const rows = await listAudit(q);
  return json({ data: rows, nextBefore: rows.length === q.limit ? rows[rows.length - 1].id : null });
});
