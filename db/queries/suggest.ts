import "server-only";
import { and, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db";
import { disputes, items, labelClasses, reports, type Report } from "@/db/schema";
import { writeAudit } from "@/lib/audit";
import { AppError } from "@/lib/errors";
import { enqueue } from "@/lib/jobs/boss";
import { getEngine } from "@/lib/suggest/cache";
import { runReportComputation } from "@/lib/suggest/jobs";
import { createReport, getLatestReport, type ReportKind } from "@/lib/suggest/reports";

/** A pending or running report older than this is taken as lost (its worker died) and replaced. */
const REPORT_STALE_MS = 30 * 60_000;

export type ReportView = {
  id: number;
  status: Report["status"];
  progress: number;
  message: string | null;
  knnVersion: number | null;
  createdAt: Date;
  finishedAt: Date | null;
  result: unknown;
};

export function toReportView(r: Report | undefined): ReportView | null {
  if (!r) return null;
  return { id: r.id, status: r.status, progress: r.progress, message: r.message, knnVersion: r.knnVersion, createdAt: r.createdAt, finishedAt: r.finishedAt, result: r.result };
}

function inFlight(r: Report | undefined) {
  return !!r && (r.status === "pending" || r.status === "running") && Date.now() - r.createdAt.getTime() < REPORT_STALE_MS;
}

/** The current knn_state.version and the number of voting items (from this process's index). */
export async function getEngineSummaryByProjectId({ projectId }: { projectId: number }) {
  const e = await getEngine(projectId);
  return { version: e.state.version, voters: e.index?.size ?? 0, items: e.state.maxSeq > 0 };
}

/**
 * Starts a report: computed inline when the project has at most `inlineMax` voters (the answer
 * carries the result), otherwise queued as a job (the page polls). An in-flight one is reused.
 */
export async function startReportByProjectId({ projectId, kind, userId, inlineMax, force = false }: { projectId: number; kind: ReportKind; userId: string | null; inlineMax: number; force?: boolean }): Promise<Report> {
  const latest = await getLatestReport(projectId, kind);
  if (!force && latest && inFlight(latest)) return latest;
  const summary = await getEngineSummaryByProjectId({ projectId });
  // The Map's cost grows with all items; Tuning's and Doubts' with the voters.
  const size = kind === "map" ? await countItemsWithProject(projectId) : summary.voters;
  const report = await createReport({ projectId, kind, params: { voters: summary.voters, size }, knnVersion: summary.version, createdBy: userId });
  if (size <= inlineMax) {
    await runReportComputation(report.id, kind);
  } else {
    await enqueue(kind as "tuning", { reportId: report.id }, { singletonKey: `${kind}:${projectId}` });
  }
  const [fresh] = await db.select().from(reports).where(eq(reports.id, report.id));
  return fresh;
}

async function countItemsWithProject(projectId: number) {
  const [row] = await db.select({ n: sql<number>`count(*)::int` }).from(items).where(eq(items.projectId, projectId));
  return row?.n ?? 0;
}

/** The latest report of a kind; when it is missing or older than the current version (and none is in flight), a new one is started. */
export async function getFreshReportByProjectId({ projectId, kind, userId, inlineMax }: { projectId: number; kind: ReportKind; userId: string | null; inlineMax: number }) {
  const { version } = await getEngineSummaryByProjectId({ projectId });
  const latest = await getLatestReport(projectId, kind);
  // A failed run for the current votes is shown as failed (the owner may recompute) rather than retried on every poll.
  const current = (latest?.status === "succeeded" || latest?.status === "failed") && latest.knnVersion === version;
  if (latest && (current || inFlight(latest))) return { report: latest, version };
  return { report: await startReportByProjectId({ projectId, kind, userId, inlineMax, force: true }), version };
}

/** Brief item rows for display (another project's ids are ignored). */
export async function listItemBriefsByIds({ projectId, ids }: { projectId: number; ids: number[] }) {
  if (!ids.length) return [];
  const rows = await db
    .select({ id: items.id, projectId: items.projectId, externalId: items.externalId, fields: items.fields, status: items.status, thumbKey: items.thumbKey, finalClassId: items.finalClassId })
    .from(items)
    .where(inArray(items.id, ids));
  return rows.filter((r) => r.projectId === projectId);
}

/** Item ids of the project with an open dispute, among `ids`. */
export async function listOpenDisputeItemIds({ projectId, ids }: { projectId: number; ids: number[] }) {
  if (!ids.length) return new Set<number>();
  const rows = await db
    .select({ itemId: disputes.itemId })
    .from(disputes)
    .where(and(eq(disputes.projectId, projectId), eq(disputes.status, "open"), inArray(disputes.itemId, ids)));
  return new Set(rows.map((r) => r.itemId));
}

export async function listClassBriefsByProjectId({ projectId }: { projectId: number }) {
  return db.select({ id: labelClasses.id, name: labelClasses.name, colour: labelClasses.colour }).from(labelClasses).where(eq(labelClasses.projectId, projectId)).orderBy(labelClasses.position, labelClasses.id);
}

/**
 * Sends a doubted item to Disputes: one open dispute (reason doubt) and the item's status
 * 'disputed', in one transaction. The partial unique index allows one open dispute per item:
 * a second one answers 409 with a clear message.
 */
export async function openDoubtDisputeByItemId({ projectId, itemId, userId, note }: { projectId: number; itemId: number; userId: string; note?: string | null }) {
  try {
    return await db.transaction(async (tx) => {
      const [item] = await tx.select({ id: items.id, projectId: items.projectId, status: items.status }).from(items).where(eq(items.id, itemId)).for("update");
      if (!item || item.projectId !== projectId) throw new AppError("not_found:item", "No such item in this project.");
      const [dispute] = await tx.insert(disputes).values({ projectId, itemId, reason: "doubt", status: "open", openedBy: userId, note: note ?? null }).returning();
      await tx.update(items).set({ status: "disputed" }).where(eq(items.id, itemId));
      await writeAudit(tx, { actorId: userId, projectId, action: "dispute.open_doubt", targetType: "item", targetId: itemId, before: { status: item.status }, after: { status: "disputed", disputeId: dispute.id } });
      return dispute;
    });
  } catch (error) {
    const e = error as { code?: string; constraint?: string; cause?: { code?: string; constraint?: string } };
    const code = e.code ?? e.cause?.code;
    const constraint = e.constraint ?? e.cause?.constraint;
    if (code === "23505" && (constraint ?? "disputes_one_open_per_item_idx") === "disputes_one_open_per_item_idx") {
      throw new AppError("conflict:dispute_open", "This item already has an open dispute; a reviewer will rule on it in Disputes.");
    }
    throw error;
  }
}

