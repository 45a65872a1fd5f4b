import { z } from "zod";

const validZone = (tz: string) => {
  try {
    new Intl.DateTimeFormat("en", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
};

/** `tz`: the annotator's IANA time zone, so "today" ends at their midnight. */
export const statsQuerySchema = z.object({ tz: z.string().max(64).refine(validZone, "an IANA time zone such as Europe/Berlin").default("UTC") });
export type StatsQuery = z.infer<typeof statsQuerySchema>;
