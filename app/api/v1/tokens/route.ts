import { createToken, listTokensByUserId } from "@/db/queries/tokens";
import { requireUser } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, readJson, route } from "@/lib/http/route";
import { createTokenSchema } from "./schema";

export const GET = route(async () => {
  const caller = await requireUser();
  return json({ data: await listTokensByUserId({ userId: caller.user.id }) });
});

/** Creates a personal API token. The secret is in this answer only. Tokens cannot mint tokens. */
export const POST = route(async (req) => {
  const caller = await requireUser();
  if (caller.via === "token") throw new AppError("forbidden:token", "Create tokens from the account page while signed in.");
  const { name } = await readJson(req, createTokenSchema);
  return json({ data: await createToken({ userId: caller.user.id, name }) }, { status: 201 });
});
