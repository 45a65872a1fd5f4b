import { z } from "zod";

/** GET and DELETE take no body or query; only the path's ids (checked by parseId). */
export const editionParamsSchema = z.object({ projectId: z.string(), editionId: z.string() });
export type EditionParams = z.infer<typeof editionParamsSchema>;
