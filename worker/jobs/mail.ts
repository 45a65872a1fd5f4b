import type { JobData } from "@/lib/jobs/queues";
import { sendMail } from "@/lib/mail/mailer";

export async function handleMail(data: JobData<"mail">) {
  await sendMail(data);
}
