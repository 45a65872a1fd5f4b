import { listUploadsByIds } from "@/db/queries/imports";
import { listClassesByProjectId } from "@/db/queries/projects";
import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { ImportFailure } from "@/lib/imports/issues";
import { previewUploads } from "@/lib/imports/preview";
import { previewSchema } from "../schema";

/** Detects the format and column roles of uploaded files and returns their first rows. */
export const POST = route<{ projectId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  const access = await requireRole(projectId, "owner");
  const body = await readJson(req, previewSchema);
  const uploads = await listUploadsByIds({ projectId, uploadIds: body.uploadIds });
  const classes = await listClassesByProjectId({ projectId });
  try {
    const preview = await previewUploads({ uploads, labelNames: new Set(classes.map((c) => c.name)), featureSchema: access.project.featureSchema ?? null });
    return json({ preview });
  } catch (error) {
    if (error instanceof ImportFailure) throw new AppError("bad_request:file", error.message);
    throw error;
  }
});
