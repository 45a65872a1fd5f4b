import { getEngineSummaryByProjectId, startReportByProjectId, toReportView } from "@/db/queries/suggest";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { getLatestReport } from "@/lib/suggest/reports";
import { TUNING_INLINE_MAX } from "@/lib/suggest/tuning";
import { startTuningSchema } from "./schema";

type P = { projectId: string };

export const dynamic = "force-dynamic";

/** The latest Tuning result (owner), with the current knn version so the page can say whether it is stale. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  const projectId = access.project.id;
  const [report, engine] = await Promise.all([getLatestReport(projectId, "tuning"), getEngineSummaryByProjectId({ projectId })]);
  const { k, distance, weighting } = access.project.settings;
  return json({ data: { report: toReportView(report), version: engine.version, voters: engine.voters, settings: { k, distance, weighting } } });
});

/** Starts Tuning: inline for small labelled sets, otherwise a job with progress. */
export const POST = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  await readJson(req, startTuningSchema);
  const report = await startReportByProjectId({ projectId: access.project.id, kind: "tuning", userId: access.user.id, inlineMax: TUNING_INLINE_MAX });
  return json({ data: { report: toReportView(report) } }, { status: report.status === "succeeded" ? 201 : 202 });
});
