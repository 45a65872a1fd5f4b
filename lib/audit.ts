import "server-only";
import type { DbOrTx } from "@/db";
import { auditLog } from "@/db/schema";

export type AuditInput = {
  actorId: string | null;
  projectId?: number | null;
  action: string;
  targetType: string;
  targetId?: string | number | null;
  before?: unknown;
  after?: unknown;
};

/** Writes one audit row inside the caller's transaction. */
export async function writeAudit(tx: DbOrTx, entry: AuditInput) {
  await tx.insert(auditLog).values({
    actorId: entry.actorId,
    projectId: entry.projectId ?? null,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId == null ? null : String(entry.targetId),
    before: entry.before ?? null,
    after: entry.after ?? null,
  });
}
