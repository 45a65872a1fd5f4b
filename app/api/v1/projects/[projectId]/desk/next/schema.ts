import { z } from "zod";
import { MAX_EXCLUDE } from "@/lib/labelling/constants";

const ids = z
  .string()
  .max(200)
  .regex(/^\d{1,10}(,\d{1,10})*$/, "a comma-separated list of item ids")
  .transform((s) => s.split(",").map(Number))
  .pipe(z.array(z.number().int().positive()).max(MAX_EXCLUDE, `at most ${MAX_EXCLUDE} ids`));

/** `exclude`: items the Desk already shows (the current one, when prefetching the next). */
export const nextQuerySchema = z.object({ exclude: ids.optional() });
export const nextBodySchema = z.object({ exclude: z.array(z.number().int().positive()).max(MAX_EXCLUDE).default([]) });
export type NextQuery = z.infer<typeof nextQuerySchema>;
