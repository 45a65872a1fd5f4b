import { z } from "zod";

const validZone = (tz: string) => {
  try {
    new Intl.DateTimeFormat("en", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
};

/** `days`: how many calendar days the labels-per-day chart covers (today included); `tz`: the IANA zone whose midnights split the days. */
export const dashboardQuerySchema = z
  .object({
    days: z.coerce.number().int().min(7).max(90).default(30),
    tz: z.string().max(64).refine(validZone, "an IANA time zone such as Europe/Berlin").default("UTC"),
  })
  .strict();
export type DashboardQuery = z.infer<typeof dashboardQuerySchema>;
