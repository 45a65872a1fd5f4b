import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db";
import { reports, type Report } from "@/db/schema";

export type ReportKind = "tuning" | "doubts" | "map";

export async function createReport(input: { projectId: number; kind: ReportKind; params: Record<string, unknown>; knnVersion: number; createdBy: string | null }): Promise<Report> {
  const [row] = await db.insert(reports).values({ ...input, status: "pending", progress: 0 }).returning();
  return row;
}

export async function getReportById(id: number): Promise<Report | undefined> {
  const [row] = await db.select().from(reports).where(eq(reports.id, id)).limit(1);
  return row;
}

/** The newest report of a kind; with `params`, only one whose params match (compared as JSON). */
export async function getLatestReport(projectId: number, kind: ReportKind): Promise<Report | undefined> {
  const [row] = await db.select().from(reports).where(and(eq(reports.projectId, projectId), eq(reports.kind, kind))).orderBy(desc(reports.createdAt), desc(reports.id)).limit(1);
  return row;
}

export async function markRunning(id: number) {
  await db.update(reports).set({ status: "running", progress: 0, message: null }).where(eq(reports.id, id));
}

export async function setProgress(id: number, progress: number, message?: string) {
  await db.update(reports).set({ progress: Math.max(0, Math.min(1, progress)), ...(message ? { message } : {}) }).where(eq(reports.id, id));
}

export async function finishReport(id: number, result: unknown, knnVersion: number) {
  await db.update(reports).set({ status: "succeeded", progress: 1, result, knnVersion, message: null, finishedAt: new Date() }).where(eq(reports.id, id));
}

export async function failReport(id: number, message: string) {
  await db.update(reports).set({ status: "failed", message: message.slice(0, 2000), finishedAt: new Date() }).where(eq(reports.id, id));
}

/** Runs `work` for a report, recording running → succeeded/failed; rethrows so the queue sees the failure. */
export async function runReport(id: number, work: (report: Report) => Promise<{ result: unknown; knnVersion: number }>) {
  const report = await getReportById(id);
  if (!report) return;
  await markRunning(id);
  try {
    const { result, knnVersion } = await work(report);
    await finishReport(id, result, knnVersion);
  } catch (error) {
    await failReport(id, error instanceof Error ? error.message : String(error));
    throw error;
  }
}
