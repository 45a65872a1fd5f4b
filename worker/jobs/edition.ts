import { publishEdition } from "@/lib/editions/run";

/** The `edition` queue's job: build and publish one edition (see lib/editions/run.ts). */
export async function handleEdition(data: { editionId: number }): Promise<void> {
  await publishEdition(data.editionId);
}
