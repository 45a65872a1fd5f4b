import { revokeToken } from "@/db/queries/tokens";
import { requireUser } from "@/lib/auth/authorize";
import { parseId, route } from "@/lib/http/route";

type P = { tokenId: string };

export const DELETE = route<P>(async (_req, { params }) => {
  const caller = await requireUser();
  await revokeToken({ userId: caller.user.id, tokenId: parseId(params.tokenId, "token") });
  return new Response(null, { status: 204 });
});
