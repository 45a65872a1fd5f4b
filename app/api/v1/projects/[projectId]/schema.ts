import { z } from "zod";
import { projectSettingsSchema } from "@/lib/projects/settings";

export const updateProjectSchema = z.object({
  name: z.string().trim().min(2).max(120).optional(),
  description: z.string().trim().max(2000).optional(),
  settings: projectSettingsSchema.partial().optional(),
});
export type UpdateProjectInput = z.infer<typeof updateProjectSchema>;
