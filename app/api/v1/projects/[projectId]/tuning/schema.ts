import { z } from "zod";

/** POST …/tuning starts a leave-one-out run (k 1..51 odd × every distance); no options. */
export const startTuningSchema = z.object({}).strict();
export type StartTuningInput = z.infer<typeof startTuningSchema>;
