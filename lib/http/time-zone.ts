import { z } from "zod";

const validZone = (tz: string) => {
  try {
    new Intl.DateTimeFormat("en", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
};

/** An IANA time zone name (checked against the runtime's zone data), UTC when absent. */
export const timeZoneSchema = z.string().max(64).refine(validZone, "an IANA time zone such as Europe/Berlin").default("UTC");
