import { z } from "zod";

/** `since`: the `next` cursor of the previous page (signed); absent for the first page. */
export const labelsQuerySchema = z.object({ since: z.string().max(500).optional(), limit: z.coerce.number().int().min(1).max(5000).default(1000) });
export type LabelsQuery = z.infer<typeof labelsQuerySchema>;
