import { z } from "zod";
import { labelPalette, projectSettingsSchema } from "@/lib/projects/settings";

const colours = labelPalette.map((c) => c.value) as [string, ...string[]];

export const classInputSchema = z.object({
  name: z.string().trim().min(1, "A label needs a name.").max(60),
  colour: z.enum(colours, { message: "Pick a colour from the palette." }),
  keyHint: z.number().int().min(1).max(9).optional(),
});

export const createProjectSchema = z
  .object({
    name: z.string().trim().min(2, "Give the project a name of at least 2 characters.").max(120),
    description: z.string().trim().max(2000).default(""),
    classes: z.array(classInputSchema).min(2, "A label set needs at least two labels.").max(9, "At most nine labels (keys 1–9)."),
    settings: projectSettingsSchema.partial().default({}),
  })
  .superRefine((v, ctx) => {
    const seen = new Set<string>();
    v.classes.forEach((c, i) => {
      const key = c.name.toLowerCase();
      if (seen.has(key)) ctx.addIssue({ code: "custom", path: ["classes", i, "name"], message: `The label "${c.name}" appears twice.` });
      seen.add(key);
    });
  });

export type CreateProjectInput = z.infer<typeof createProjectSchema>;

export const listQuerySchema = z.object({ limit: z.coerce.number().int().min(1).max(200).default(50), cursor: z.string().optional() });
