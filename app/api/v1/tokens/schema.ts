import { z } from "zod";

export const createTokenSchema = z.object({ name: z.string().trim().min(1, "Name the token after the script that uses it.").max(80) });
export type CreateTokenInput = z.infer<typeof createTokenSchema>;
