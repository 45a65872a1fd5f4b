import { createUpload } from "@/db/queries/imports";
import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { formatBytes } from "@/lib/imports/format-bytes";
import { limits } from "@/lib/imports/limits";
import { startMultipart } from "@/lib/imports/multipart";
import { presignPut } from "@/lib/storage/s3";
import { createUploadSchema } from "./schema";

/** Registers a file and returns where the browser PUTs it: one presigned URL, or one per part for large files. */
export const POST = route<{ projectId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const access = await requireRole(projectId, "owner");
  const body = await readJson(req, createUploadSchema);
  if (body.size === 0) throw new AppError("bad_request:empty_file", `\`${body.fileName}\` is empty (0 bytes).`);
  if (body.size > limits.uploadMaxBytes) {
    throw new AppError("too_large:upload", `\`${body.fileName}\` is ${formatBytes(body.size)}; the limit per file is ${formatBytes(limits.uploadMaxBytes)}. Split it, or ask your admin to raise UPLOAD_MAX_BYTES.`);
  }
  const upload = await createUpload({ projectId, userId: access.user.id, fileName: body.fileName, size: body.size, contentType: body.contentType });
  const view = { id: upload.id, fileName: upload.fileName, size: upload.size };
  if (body.size <= limits.multipartThreshold) {
    return json({ upload: view, mode: "single", url: await presignPut(upload.objectKey, body.contentType) }, { status: 201 });
  }
  const mp = await startMultipart(upload.objectKey, body.size, body.contentType);
  return json({ upload: view, mode: "multipart", ...mp }, { status: 201 });
});
