import { z } from "zod";

export const adminAuditQuerySchema = z.object({
  projectId: z.coerce.number().int().positive().optional(),
  action: z.string().max(60).optional(),
  actor: z.string().max(120).optional(),
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(500).default(100),
});
