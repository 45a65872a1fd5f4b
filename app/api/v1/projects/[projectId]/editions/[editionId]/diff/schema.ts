import { z } from "zod";

export const diffQuerySchema = z.object({
  against: z.string().regex(/^\d{1,10}$/, "against: give the id of the earlier edition."),
  format: z.enum(["json", "csv"]).default("json"),
  limit: z.coerce.number().int().min(0).max(1000).default(200),
});
export type DiffQuery = z.infer<typeof diffQuerySchema>;
