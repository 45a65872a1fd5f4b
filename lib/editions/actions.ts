import "server-only";
import { db } from "@/db";
import { deleteEditionById, getEditionById, insertEditionByProjectId, setEditionStatusById } from "@/db/queries/editions";
import { writeAudit } from "@/lib/audit";
import { enqueue } from "@/lib/jobs/boss";
import type { EditionOptions } from "./options";
import { deleteEditionObjects } from "./storage";

/** Creates the next pending edition (audit-logged in the same transaction) and queues the job that builds it. */
export async function createEdition({ projectId, userId, options }: { projectId: number; userId: string; options: EditionOptions }) {
  const edition = await db.transaction(async (tx) => {
    const row = await insertEditionByProjectId({ tx, projectId, userId, options });
    await writeAudit(tx, { actorId: userId, projectId, action: "edition.publish", targetType: "edition", targetId: row.id, after: { number: row.number, options } });
    return row;
  });
  try {
    await enqueue("edition", { editionId: edition.id });
  } catch (error) {
    await setEditionStatusById({ editionId: edition.id, status: "failed", message: "The job queue could not be reached; publish again." });
    throw error;
  }
  return getEditionById({ projectId, editionId: edition.id });
}

/**
 * Site admins only (checked by the caller): removes the edition row, writes the audit entry and deletes its
 * objects in one transaction, so a storage failure leaves the edition in place to delete again.
 */
export async function removeEdition({ projectId, editionId, actorId }: { projectId: number; editionId: number; actorId: string }) {
  await db.transaction(async (tx) => {
    const e = await getEditionById({ projectId, editionId, tx });
    const m = e.manifest as { counts?: { rows?: number }; files?: Record<string, { sha256: string }> } | null;
    await deleteEditionById({ tx, editionId });
    await writeAudit(tx, {
      actorId,
      projectId,
      action: "edition.delete",
      targetType: "edition",
      targetId: editionId,
      before: { number: e.number, status: e.status, createdBy: e.createdBy, publishedAt: e.publishedAt, rows: m?.counts?.rows ?? null, sha256: m?.files ? Object.fromEntries(Object.entries(m.files).map(([k, f]) => [k, f.sha256])) : null },
    });
    await deleteEditionObjects(projectId, editionId);
  });
}
