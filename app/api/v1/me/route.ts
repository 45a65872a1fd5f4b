import { requireUser } from "@/lib/auth/authorize";
import { json, route } from "@/lib/http/route";

export const GET = route(async () => {
  const { user, via } = await requireUser();
  return json({ data: { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin, via } });
});
