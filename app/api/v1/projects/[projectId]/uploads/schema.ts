import { z } from "zod";

export const createUploadSchema = z.object({
  fileName: z.string().trim().min(1).max(255),
  size: z.number().int().min(0),
  contentType: z.string().max(200).default("application/octet-stream"),
});
export type CreateUpload = z.infer<typeof createUploadSchema>;
