import { listUsers } from "@/db/queries/users";
import { requireAdmin } from "@/lib/auth/authorize";
import { json, route, searchParams } from "@/lib/http/route";
import { adminUsersQuerySchema } from "./schema";

export const GET = route(async (req) => {
  await requireAdmin();
  const { q } = adminUsersQuerySchema.parse(Object.fromEntries(searchParams(req)));
  return json({ data: await listUsers({ query: q }) });
});
