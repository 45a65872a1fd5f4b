// No "server-only" here: the worker (plain Node) runs this module too.
import { db } from "@/db";
import {
  countLiveLabelsByProjectId,
  getAgreementReportByProjectId,
  getKnnVersionByProjectId,
  lockAgreementByProjectId,
  saveAgreementReportByProjectId,
} from "@/db/queries/agreement";
import { enqueue } from "@/lib/jobs/boss";
import { isStoredAgreement, refreshProjectAgreement } from "./compute";
import type { StoredAgreement } from "./types";

/** Projects with fewer live labels are computed inside the request; larger ones by the worker. */
export const INLINE_LABEL_LIMIT = 200_000;
/** A queued job not finished after this long is queued again. */
const REQUEUE_AFTER_MS = 10 * 60_000;

export type ProjectAgreement = {
  stored: StoredAgreement | null;
  currentVersion: number;
  stale: boolean;
  queued: boolean;
};

/**
 * The project's agreement report for the current labels: the cached one when its knn_state version is
 * current; otherwise computed now (small projects) or queued for the worker, answering with the last
 * report marked stale (or none yet).
 */
export async function getProjectAgreement({ projectId, inlineLimit = INLINE_LABEL_LIMIT }: { projectId: number; inlineLimit?: number }): Promise<ProjectAgreement> {
  const [version, cached] = await Promise.all([getKnnVersionByProjectId({ projectId }), getAgreementReportByProjectId({ projectId })]);
  const last = cached && isStoredAgreement(cached.result) ? cached.result : null;
  if (last && cached?.knnVersion === version) return { stored: last, currentVersion: version, stale: false, queued: false };
  const labels = await countLiveLabelsByProjectId({ projectId });
  if (labels < inlineLimit) {
    const stored = await refreshProjectAgreement({ projectId });
    return { stored, currentVersion: Math.max(version, stored.knnVersion), stale: false, queued: false };
  }
  await queueProjectAgreement({ projectId, version });
  return { stored: last, currentVersion: version, stale: last !== null, queued: true };
}

/** Queues the worker job once per knn_state version (again if a queued one seems lost). */
export async function queueProjectAgreement({ projectId, version }: { projectId: number; version: number }): Promise<boolean> {
  return db.transaction(async (tx) => {
    await lockAgreementByProjectId({ projectId, tx });
    const row = await getAgreementReportByProjectId({ projectId, tx });
    const queuedFor = Number(row?.params.queuedFor ?? -1);
    const queuedAt = Date.parse(String(row?.params.queuedAt ?? ""));
    const pending = row?.status === "pending" || row?.status === "running";
    if (pending && queuedFor >= version && Date.now() - queuedAt < REQUEUE_AFTER_MS) return false;
    await enqueue("agreement", { projectId });
    await saveAgreementReportByProjectId({ projectId, tx, values: { status: "pending", params: { ...row?.params, queuedFor: version, queuedAt: new Date().toISOString() } } });
    return true;
  });
}

/** The worker's side: compute, cache, and record a failure on the row before rethrowing. */
export async function runQueuedAgreement({ projectId }: { projectId: number }): Promise<StoredAgreement> {
  try {
    return await refreshProjectAgreement({ projectId });
  } catch (error) {
    await db.transaction(async (tx) => {
      await saveAgreementReportByProjectId({ projectId, tx, values: { status: "failed", message: (error instanceof Error ? error.message : String(error)).slice(0, 2000), finished: true } });
    });
    throw error;
  }
}
