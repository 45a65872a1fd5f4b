import { z } from "zod";

export const rulingSchema = z.object({
  classId: z.number().int().positive(),
  reason: z.string().trim().min(3, "give the reason for the ruling in a few words").max(2000),
});
export type RulingBody = z.infer<typeof rulingSchema>;
