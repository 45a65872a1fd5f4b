import { NextResponse } from "next/server";
import { getImportById } from "@/db/queries/imports";
import { requireRole } from "@/lib/auth/authorize";
import { AppError } from "@/lib/errors";
import { json, parseId, route, searchParams } from "@/lib/http/route";
import { importIdOf } from "@/lib/imports/ids";
import { presignGet } from "@/lib/storage/s3";

/** The full error list as CSV: a redirect to a short-lived bucket URL (or the URL as JSON with ?format=json). */
export const GET = route<{ projectId: string; importId: string }>(async (req, { params }) => {
  const projectId = parseId(params.projectId, "project");
  await requireRole(projectId, "owner");
  const row = await getImportById({ projectId, importId: importIdOf(params.importId) });
  if (!row.errorReportKey) throw new AppError("not_found:error_report", "This import has no error report.");
  const url = await presignGet(row.errorReportKey, undefined, `import-${row.id.slice(0, 8)}-errors.csv`);
  if (searchParams(req).get("format") === "json") return json({ url });
  return NextResponse.redirect(url, 302);
});
