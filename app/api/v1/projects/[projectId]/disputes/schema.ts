import { z } from "zod";

const classId = z.coerce.number().int().positive();

export const disputesQuerySchema = z
  .object({
    status: z.enum(["open", "ruled"]).default("open"),
    reason: z.enum(["disagreement", "doubt"]).optional(),
    /** A class pair: disputes whose labels (or, for doubts, final label) involve both classes. One alone filters by that class. */
    classA: classId.optional(),
    classB: classId.optional(),
    /** Age in hours since the dispute opened. */
    minAgeHours: z.coerce.number().min(0).max(100_000).optional(),
    maxAgeHours: z.coerce.number().min(0).max(100_000).optional(),
    cursor: z.string().max(500).optional(),
    limit: z.coerce.number().int().min(1).max(200).default(50),
  })
  .refine((q) => q.minAgeHours == null || q.maxAgeHours == null || q.minAgeHours <= q.maxAgeHours, { message: "must not be above maxAgeHours", path: ["minAgeHours"] });
export type DisputesQuery = z.infer<typeof disputesQuerySchema>;
