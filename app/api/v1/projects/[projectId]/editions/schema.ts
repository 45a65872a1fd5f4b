import { z } from "zod";
import { editionOptionsSchema } from "@/lib/editions/options";

export const listEditionsQuerySchema = z.object({ limit: z.coerce.number().int().min(1).max(100).default(20), cursor: z.string().optional() });
export type ListEditionsQuery = z.infer<typeof listEditionsQuerySchema>;

/** POST body: which items, an optional stratified split, and how annotators are named. All optional. */
export const createEditionSchema = editionOptionsSchema;
export type CreateEditionInput = z.infer<typeof createEditionSchema>;
