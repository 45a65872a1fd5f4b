import { z } from "zod";
import { timeZoneSchema } from "@/lib/http/time-zone";

/** `days`: how many calendar days the labels-per-day chart covers (today included); `tz`: the IANA zone whose midnights split the days. */
export const dashboardQuerySchema = z
  .object({
    days: z.coerce.number().int().min(7).max(90).default(30),
    tz: timeZoneSchema,
  })
  .strict();
export type DashboardQuery = z.infer<typeof dashboardQuerySchema>;
