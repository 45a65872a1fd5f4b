import { z } from "zod";

export const flagSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("skip"), comment: z.string().trim().max(2000).optional() }),
  z.object({ kind: z.literal("flag"), comment: z.string().trim().min(3, "say in a few words what is unclear").max(2000) }),
]);
export type FlagBody = z.infer<typeof flagSchema>;
