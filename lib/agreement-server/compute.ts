// No "server-only" here: the worker (plain Node) runs this module too.
import { type DbOrTx, db } from "@/db";
import {
  getAgreementReportByProjectId,
  getAgreementRowsByProjectId,
  getKnnVersionByProjectId,
  lockAgreementByProjectId,
  saveAgreementReportByProjectId,
} from "@/db/queries/agreement";
import { type AgreementOptions, computeAgreement } from "@/lib/agreement";
import { buildAgreementInputs } from "./input";
import type { StoredAgreement } from "./types";

/** Bootstrap settings of every cached report (docs/agreement.md: 1000 resamples, seed 1). */
export const AGREEMENT_OPTIONS: AgreementOptions = { resamples: 1000, seed: 1, detailIntervals: true };

/** Reads the project's live labels in one snapshot and computes the overall and blind-only reports. */
export async function computeProjectAgreement({ projectId, tx = db, options = AGREEMENT_OPTIONS }: { projectId: number; tx?: DbOrTx; options?: AgreementOptions }): Promise<StoredAgreement> {
  const started = performance.now();
  const rows = await getAgreementRowsByProjectId({ projectId, tx });
  const inputs = buildAgreementInputs(rows);
  const overall = computeAgreement(inputs.overall, options);
  const blind = computeAgreement(inputs.blind, options);
  return {
    format: 1,
    knnVersion: rows.version,
    computedAt: new Date().toISOString(),
    seconds: Math.round(performance.now() - started) / 1000,
    labels: rows.labels,
    blindItems: inputs.blindItems,
    annotatorIds: rows.annotatorIds,
    classIds: rows.classIds,
    suggestionCounts: inputs.suggestionCounts,
    overall,
    blind,
  };
}

export function isStoredAgreement(value: unknown): value is StoredAgreement {
  return typeof value === "object" && value !== null && (value as { format?: unknown }).format === 1;
}

/**
 * Computes and caches the project's report unless the cached one already covers the current labels.
 * Per-project advisory lock: concurrent callers wait and then find the fresh report instead of recomputing.
 */
export async function refreshProjectAgreement({ projectId, force = false }: { projectId: number; force?: boolean }): Promise<StoredAgreement> {
  return db.transaction(async (tx) => {
    await lockAgreementByProjectId({ projectId, tx });
    const cached = await getAgreementReportByProjectId({ projectId, tx });
    if (!force && cached && isStoredAgreement(cached.result)) {
      if (cached.knnVersion === (await getKnnVersionByProjectId({ projectId, tx }))) return cached.result;
    }
    const stored = await computeProjectAgreement({ projectId, tx });
    await saveAgreementReportByProjectId({
      projectId,
      tx,
      values: { status: "succeeded", knnVersion: stored.knnVersion, result: stored, params: { resamples: AGREEMENT_OPTIONS.resamples, seed: AGREEMENT_OPTIONS.seed }, message: null, finished: true },
    });
    return stored;
  });
}
