import { z } from "zod";

/** POST …/doubts recomputes the Doubts list now; no options. */
export const recomputeDoubtsSchema = z.object({}).strict();
export type RecomputeDoubtsInput = z.infer<typeof recomputeDoubtsSchema>;
