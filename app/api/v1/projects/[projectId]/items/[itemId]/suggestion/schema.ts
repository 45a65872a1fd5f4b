import { z } from "zod";

export const suggestionNeighbourSchema = z.object({
  itemId: z.number().int(),
  externalId: z.string(),
  classId: z.number().int(),
  distance: z.number().nonnegative(),
  fields: z.record(z.string(), z.unknown()),
  thumbUrl: z.string().nullable(),
});

/** GET …/suggestion answers `{ data }` with one of these. */
export const suggestionResponseSchema = z.union([
  z.object({ itemId: z.number().int(), blind: z.literal(true) }),
  z.object({
    itemId: z.number().int(),
    blind: z.literal(false),
    topClassId: z.number().int().nullable(),
    shares: z.record(z.string(), z.number().min(0).max(1)),
    k: z.number().int().min(1),
    distance: z.enum(["euclidean", "manhattan", "cosine"]),
    weighting: z.enum(["uniform", "inverse"]),
    neighbours: z.array(suggestionNeighbourSchema),
    votersCount: z.number().int().nonnegative(),
    knnVersion: z.number().int(),
    engineVersion: z.string(),
  }),
]);
export type SuggestionResponse = z.infer<typeof suggestionResponseSchema>;
