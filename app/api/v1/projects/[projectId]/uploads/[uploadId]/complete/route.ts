import { getUploadById, setUploadStatus } from "@/db/queries/imports";
import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { formatBytes } from "@/lib/imports/format-bytes";
import { limits } from "@/lib/imports/limits";
import { completeMultipart } from "@/lib/imports/multipart";
import { importIdOf } from "@/lib/imports/ids";
import { objectSize } from "@/lib/imports/storage";
import { completeUploadSchema } from "./schema";

/** Called once the browser has PUT the bytes: joins the parts, then checks the object's real size. */
export const POST = route<{ projectId: string; uploadId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  await requireRole(projectId, "owner");
  const body = await readJson(req, completeUploadSchema);
  const upload = await getUploadById({ projectId, uploadId: importIdOf(params.uploadId, "upload") });
  if (body.multipartId && body.parts?.length) await completeMultipart(upload.objectKey, body.multipartId, body.parts);
  let size: number;
  try {
    size = await objectSize(upload.objectKey);
  } catch {
    await setUploadStatus({ uploadId: upload.id, status: "failed" });
    throw new AppError("conflict:upload", `\`${upload.fileName}\` is not in the bucket yet; upload it again.`);
  }
  if (size > limits.uploadMaxBytes || size !== upload.size) {
    await setUploadStatus({ uploadId: upload.id, status: "failed" });
    throw new AppError(size > limits.uploadMaxBytes ? "too_large:upload" : "conflict:upload", size > limits.uploadMaxBytes ? `\`${upload.fileName}\` is ${formatBytes(size)}; the limit is ${formatBytes(limits.uploadMaxBytes)}.` : `\`${upload.fileName}\` arrived as ${size} bytes, not the ${upload.size} announced; upload it again.`);
  }
  const row = await setUploadStatus({ uploadId: upload.id, status: "uploaded" });
  return json({ upload: { id: row.id, fileName: row.fileName, size: row.size, status: row.status } });
});
