import type { JobData, JobName } from "@/lib/jobs/queues";
import { handleAgreement } from "./jobs/agreement";
import { handleDisputeDigest } from "./jobs/dispute-digest";
import { handleDoubts } from "./jobs/doubts";
import { handleEdition } from "./jobs/edition";
import { handleImport } from "./jobs/import";
import { handleMail } from "./jobs/mail";
import { handleMap } from "./jobs/map";
import { handlePoolRank } from "./jobs/pool-rank";
import { handleTuning } from "./jobs/tuning";

type Handlers = { [N in JobName]?: (data: JobData<N>) => Promise<void> };

/** Which job each queue runs. */
export const handlers: Handlers = {
  mail: handleMail,
  import: handleImport,
  edition: handleEdition,
  agreement: handleAgreement,
  "dispute-digest": handleDisputeDigest,
  "pool-rank": handlePoolRank,
  tuning: handleTuning,
  doubts: handleDoubts,
  map: handleMap,
};
