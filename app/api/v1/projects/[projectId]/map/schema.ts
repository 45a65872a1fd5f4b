import { z } from "zod";

/** GET …/map takes no query options: the answer carries regions for every k the slider offers. */
export const mapQuerySchema = z.object({}).strict();
export type MapQuery = z.infer<typeof mapQuerySchema>;
