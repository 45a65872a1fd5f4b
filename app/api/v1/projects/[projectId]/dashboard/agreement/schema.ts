import { z } from "zod";

/** GET …/dashboard/agreement takes no query parameters; unknown ones are refused. */
export const agreementSummaryQuerySchema = z.object({}).strict();
export type AgreementSummaryQuery = z.infer<typeof agreementSummaryQuerySchema>;
