import { z } from "zod";
import { itemSorts, itemStatusFilters } from "@/db/queries/items";

export const listItemsQuerySchema = z.object({
  status: z.enum(itemStatusFilters).optional(),
  label: z.coerce.number().int().positive().optional(),
  shareMin: z.coerce.number().min(0).max(1).optional(),
  shareMax: z.coerce.number().min(0).max(1).optional(),
  q: z.string().trim().max(200).optional().transform((v) => (v ? v : undefined)),
  sort: z.enum(itemSorts).default("seq"),
  dir: z.enum(["asc", "desc"]).default("asc"),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  cursor: z.string().max(2000).optional(),
});
export type ListItemsQuery = z.infer<typeof listItemsQuerySchema>;
