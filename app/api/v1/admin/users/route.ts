import { z } from "zod";
import { listUsers } from "@/db/queries/users";
import { requireAdmin } from "@/lib/auth/authorize";
import { json, route, searchParams } from "@/lib/http/route";

const querySchema = z.object({ q: z.string().trim().max(120).optional() });

export const GET = route(async (req) => {
  await requireAdmin();
  const { q } = querySchema.parse(Object.fromEntries(searchParams(req)));
  return json({ data: await listUsers({ query: q }) });
});
