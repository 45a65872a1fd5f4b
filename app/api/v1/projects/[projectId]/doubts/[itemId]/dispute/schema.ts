import { z } from "zod";

export const sendToDisputesSchema = z.object({ note: z.string().trim().max(1000).optional() }).strict();
export type SendToDisputesInput = z.infer<typeof sendToDisputesSchema>;
