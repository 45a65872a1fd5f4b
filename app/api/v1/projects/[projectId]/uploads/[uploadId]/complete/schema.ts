import { z } from "zod";

export const completeUploadSchema = z.object({
  multipartId: z.string().min(1).max(1000).optional(),
  parts: z.array(z.object({ partNumber: z.number().int().min(1).max(10_000), etag: z.string().min(1).max(200) })).max(10_000).optional(),
});
export type CompleteUpload = z.infer<typeof completeUploadSchema>;
