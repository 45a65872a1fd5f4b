import { z } from "zod";
import { timeZoneSchema } from "@/lib/http/time-zone";

/** `tz`: the annotator's IANA time zone, so "today" ends at their midnight. */
export const statsQuerySchema = z.object({ tz: timeZoneSchema });
export type StatsQuery = z.infer<typeof statsQuerySchema>;
