import { z } from "zod";

export const projectAuditQuerySchema = z.object({
  action: z.string().max(60).optional(),
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
