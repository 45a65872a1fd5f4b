import type { JobData, JobName } from "@/lib/jobs/queues";
import { handleMail } from "./jobs/mail";

type Handlers = { [N in JobName]?: (data: JobData<N>) => Promise<void> };

/** Which job each queue runs. */
export const handlers: Handlers = {
  mail: handleMail,
};
