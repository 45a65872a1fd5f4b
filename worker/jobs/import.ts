import { eq } from "drizzle-orm";
import { db } from "@/db";
import { imports } from "@/db/schema";
import { runImport } from "@/lib/imports/run";
import { enqueuePoolRank } from "@/lib/suggest/pool-trigger";
import { beatWhileRunning } from "../watch/stalled-imports";

/** The `import` queue's job: validate and store one import, all or nothing (see lib/imports/run.ts); then re-rank the pool. */
export async function handleImport(data: { importId: string }): Promise<void> {
  const stopBeating = beatWhileRunning(data.importId);
  try {
    await runImport(data.importId);
  } finally {
    stopBeating();
  }
  const [row] = await db.select({ projectId: imports.projectId, status: imports.status, created: imports.itemsCreated }).from(imports).where(eq(imports.id, data.importId));
  if (row?.status === "succeeded" && row.created > 0) await enqueuePoolRank(row.projectId);
}
