import "server-only";
import { randomUUID } from "node:crypto";
import { and, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db";
import { imports, uploads, type Import } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { uploadKey } from "@/lib/imports/storage";
import type { ImportOptions } from "@/lib/imports/types";

export async function createUpload({ projectId, userId, fileName, size, contentType }: { projectId: number; userId: string; fileName: string; size: number; contentType: string }) {
  const id = randomUUID();
  const [row] = await db
    .insert(uploads)
    .values({ id, projectId, objectKey: uploadKey(projectId, id, fileName), fileName, size, contentType, createdBy: userId })
    .returning();
  return row;
}

export async function getUploadById({ projectId, uploadId }: { projectId: number; uploadId: string }) {
  const [row] = await db.select().from(uploads).where(and(eq(uploads.id, uploadId), eq(uploads.projectId, projectId))).limit(1);
  if (!row) throw new AppError("not_found:upload", "No such upload in this project.");
  return row;
}

export async function setUploadStatus({ uploadId, status }: { uploadId: string; status: "uploaded" | "failed" }) {
  const [row] = await db.update(uploads).set({ status }).where(eq(uploads.id, uploadId)).returning();
  return row;
}

/** Uploads in the order asked for; every one must belong to the project and be in the bucket. */
export async function listUploadsByIds({ projectId, uploadIds }: { projectId: number; uploadIds: string[] }) {
  const rows = uploadIds.length ? await db.select().from(uploads).where(and(eq(uploads.projectId, projectId), inArray(uploads.id, uploadIds))) : [];
  return uploadIds.map((id) => {
    const row = rows.find((r) => r.id === id);
    if (!row) throw new AppError("not_found:upload", `No upload ${id} in this project.`);
    if (row.status !== "uploaded") throw new AppError("conflict:upload", `\`${row.fileName}\` has not finished uploading.`);
    return row;
  });
}

export async function createImport({ projectId, userId, uploadIds, format, options }: { projectId: number; userId: string; uploadIds: string[]; format: string; options: ImportOptions }) {
  const [row] = await db.insert(imports).values({ projectId, uploadIds, format, options, createdBy: userId }).returning();
  return row;
}

export async function getImportById({ projectId, importId }: { projectId: number; importId: string }) {
  const [row] = await db.select().from(imports).where(and(eq(imports.id, importId), eq(imports.projectId, projectId))).limit(1);
  if (!row) throw new AppError("not_found:import", "No such import in this project.");
  return row;
}

export async function listImportsByProjectId({ projectId, limit = 20 }: { projectId: number; limit?: number }) {
  return db.select().from(imports).where(eq(imports.projectId, projectId)).orderBy(desc(imports.createdAt)).limit(limit);
}

/** A pending import is cancelled at once; a running one stops at its next progress check and rolls back. */
export async function requestImportCancel({ projectId, importId }: { projectId: number; importId: string }): Promise<Import> {
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(imports).where(and(eq(imports.id, importId), eq(imports.projectId, projectId))).for("update");
    if (!row) throw new AppError("not_found:import", "No such import in this project.");
    if (row.status === "pending") {
      const [out] = await tx.update(imports).set({ status: "cancelled", cancelRequested: true, message: "Cancelled before it started; nothing was imported.", finishedAt: new Date() }).where(eq(imports.id, importId)).returning();
      return out;
    }
    if (row.status !== "running") throw new AppError("conflict:import", `The import has already ${row.status === "succeeded" ? "finished" : row.status}.`);
    const [out] = await tx.update(imports).set({ cancelRequested: true }).where(eq(imports.id, importId)).returning();
    return out;
  });
}

/** The public shape of an import for the API and the UI. */
export function importView(row: Import) {
  return {
    id: row.id,
    format: row.format,
    status: row.status,
    rowsDone: row.rowsDone,
    rowsTotal: row.rowsTotal,
    itemsCreated: row.itemsCreated,
    itemsSkipped: row.itemsSkipped,
    errorCount: row.errorCount,
    errors: row.errors,
    hasErrorReport: Boolean(row.errorReportKey),
    message: row.message,
    cancelRequested: row.cancelRequested,
    createdAt: row.createdAt,
    startedAt: row.startedAt,
    finishedAt: row.finishedAt,
  };
}
export type ImportView = ReturnType<typeof importView>;
