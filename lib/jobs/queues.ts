import { z } from "zod";

/** Every background job Vicinal runs, with its payload schema. */
export const jobSchemas = {
  mail: z.object({ to: z.string().email(), subject: z.string(), text: z.string(), html: z.string().optional() }),
  import: z.object({ importId: z.string().uuid() }),
  "pool-rank": z.object({ projectId: z.number().int() }),
  tuning: z.object({ reportId: z.number().int() }),
  map: z.object({ reportId: z.number().int() }),
  doubts: z.object({ reportId: z.number().int() }),
  agreement: z.object({ projectId: z.number().int() }),
  edition: z.object({ editionId: z.number().int() }),
  "dispute-digest": z.object({ projectId: z.number().int() }),
} as const;

export type JobName = keyof typeof jobSchemas;
export type JobData<N extends JobName> = z.infer<(typeof jobSchemas)[N]>;
export const jobNames = Object.keys(jobSchemas) as JobName[];

/** Retry policy per queue: imports and editions retry after a crash; mail retries with backoff. */
export const queuePolicies: Record<JobName, { retryLimit: number; retryDelay: number; expireInSeconds: number }> = {
  mail: { retryLimit: 5, retryDelay: 10, expireInSeconds: 60 },
  // pg-boss 10 has no heartbeat: a job whose worker died is retried only after it expires. 15 minutes covers a
  // 10-million-row import at the measured rate; raise it for larger single files.
  import: { retryLimit: 3, retryDelay: 2, expireInSeconds: 900 },
  "pool-rank": { retryLimit: 1, retryDelay: 5, expireInSeconds: 1800 },
  tuning: { retryLimit: 1, retryDelay: 5, expireInSeconds: 1800 },
  map: { retryLimit: 1, retryDelay: 5, expireInSeconds: 600 },
  doubts: { retryLimit: 1, retryDelay: 5, expireInSeconds: 1800 },
  agreement: { retryLimit: 1, retryDelay: 5, expireInSeconds: 600 },
  edition: { retryLimit: 3, retryDelay: 5, expireInSeconds: 1800 },
  "dispute-digest": { retryLimit: 3, retryDelay: 10, expireInSeconds: 120 },
};
