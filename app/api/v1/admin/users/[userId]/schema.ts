import { z } from "zod";

export const adminUserPatchSchema = z
  .object({
    isAdmin: z.boolean().optional(),
    deactivated: z.boolean().optional(),
    membership: z.object({ projectId: z.number().int().positive(), role: z.enum(["owner", "reviewer", "annotator", "viewer"]).nullable() }).optional(),
  })
  .refine((v) => v.isAdmin !== undefined || v.deactivated !== undefined || v.membership !== undefined, "Nothing to change.");
