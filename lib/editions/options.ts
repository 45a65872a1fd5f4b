import { z } from "zod";

/** What a row may come from: the four label sources, plus disputed items (no final label yet). */
export const includeSources = ["agreed", "ruling", "single", "control", "disputed"] as const;
export type IncludeSource = (typeof includeSources)[number];
export const defaultInclude: IncludeSource[] = ["agreed", "ruling", "single", "control"];

export const splitNames = ["train", "validation", "test"] as const;
export type SplitName = (typeof splitNames)[number];

export const splitOptionsSchema = z
  .object({
    seed: z.number().int().min(0).max(2_147_483_647),
    train: z.number().min(0).max(1),
    validation: z.number().min(0).max(1),
    test: z.number().min(0).max(1),
  })
  .refine((s) => Math.abs(s.train + s.validation + s.test - 1) < 1e-6, { message: "The train, validation and test fractions must add up to 1." });
export type SplitOptions = z.infer<typeof splitOptionsSchema>;

export const editionOptionsSchema = z.object({
  include: z
    .array(z.enum(includeSources))
    .min(1, "Include at least one kind of item.")
    .default(defaultInclude)
    .transform((list) => includeSources.filter((s) => list.includes(s))),
  split: splitOptionsSchema.nullable().default(null),
  /** "id" (default) names annotators by their user id; "email" by their e-mail address. */
  annotatorIdentity: z.enum(["id", "email"]).default("id"),
});
export type EditionOptions = z.infer<typeof editionOptionsSchema>;

export const defaultEditionOptions: EditionOptions = { include: defaultInclude, split: null, annotatorIdentity: "id" };

/** Options as stored on an edition row (validated again, so an old or hand-edited row cannot break the job). */
export function readEditionOptions(value: unknown): EditionOptions {
  return editionOptionsSchema.parse(value ?? {});
}
