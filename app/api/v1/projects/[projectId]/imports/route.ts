import { createImport, importView, listImportsByProjectId, listUploadsByIds } from "@/db/queries/imports";
import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { enqueue } from "@/lib/jobs/boss";
import { createImportSchema } from "./schema";

export const GET = route<{ projectId: string }>(async (_req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  await requireRole(projectId, "owner");
  const rows = await listImportsByProjectId({ projectId });
  return json({ imports: rows.map(importView) });
});

/** Queues an import of confirmed uploads with the owner's column roles; the worker does the rest. */
export const POST = route<{ projectId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const access = await requireRole(projectId, "owner");
  const body = await readJson(req, createImportSchema, 5_000_000);
  await listUploadsByIds({ projectId, uploadIds: body.uploadIds });
  if (body.format !== "images" && body.uploadIds.length !== 1) throw new AppError("bad_request:uploads", "Import one table file at a time.");
  if (body.format !== "images" && !body.columns.some((c) => c.role !== "ignore")) throw new AppError("bad_request:columns", "Give the columns their roles before importing.");
  if (body.embeddingsUploadId && !body.uploadIds.includes(body.embeddingsUploadId)) throw new AppError("bad_request:uploads", "The embeddings file must be one of the uploads.");
  const row = await createImport({
    projectId,
    userId: access.user.id,
    uploadIds: body.uploadIds,
    format: body.format,
    options: { columns: body.columns, delimiter: body.delimiter, embeddingsUploadId: body.embeddingsUploadId, embeddingsColumns: body.embeddingsColumns },
  });
  await enqueue("import", { importId: row.id });
  return json({ import: importView(row) }, { status: 202 });
});
