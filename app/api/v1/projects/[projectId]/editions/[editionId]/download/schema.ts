import { z } from "zod";
import { editionFormats } from "@/lib/editions/storage";

export const downloadQuerySchema = z.object({ format: z.enum(editionFormats).default("csv") });
export type DownloadQuery = z.infer<typeof downloadQuerySchema>;
