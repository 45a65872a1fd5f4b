import { z } from "zod";
import { importFormats, roleMappingSchema } from "@/lib/imports/types";

export const previewSchema = z.object({ uploadIds: z.array(z.string().uuid()).min(1).max(10_000) });

export const createImportSchema = z.object({
  uploadIds: z.array(z.string().uuid()).min(1).max(10_000),
  format: z.enum(importFormats),
  columns: roleMappingSchema.max(100_000).default([]),
  delimiter: z.enum([",", ";", "\t", "|"]).optional(),
  embeddingsUploadId: z.string().uuid().optional(),
  embeddingsColumns: roleMappingSchema.optional(),
});
export type CreateImport = z.infer<typeof createImportSchema>;
