import { getFreshReportByProjectId, listClassBriefsByProjectId, listItemBriefsByIds, listOpenDisputeItemIds, startReportByProjectId, toReportView } from "@/db/queries/suggest";
import { requireRole } from "@/lib/auth/authorize";
import { json, parseId, readJson, route } from "@/lib/http/route";
import { DOUBTS_INLINE_MAX, type DoubtsReport } from "@/lib/suggest/doubts";
import { recomputeDoubtsSchema } from "./schema";

type P = { projectId: string };

export const dynamic = "force-dynamic";

/** Doubts (owner): the latest list for the current votes (recomputed when stale), with item details and open-dispute marks. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  const projectId = access.project.id;
  const { report, version } = await getFreshReportByProjectId({ projectId, kind: "doubts", userId: access.user.id, inlineMax: DOUBTS_INLINE_MAX });
  const result = report.status === "succeeded" ? (report.result as DoubtsReport | { empty: true }) : null;
  const doubts = result && "doubts" in result ? result.doubts : [];
  const ids = [...new Set(doubts.flatMap((d) => [d.itemId, ...d.neighbours.map((n) => n.itemId)]))];
  const [briefs, open, classes] = await Promise.all([listItemBriefsByIds({ projectId, ids }), listOpenDisputeItemIds({ projectId, ids: doubts.map((d) => d.itemId) }), listClassBriefsByProjectId({ projectId })]);
  const items = Object.fromEntries(briefs.map((b) => [b.id, { externalId: b.externalId, fields: b.fields, status: b.status, finalClassId: b.finalClassId }]));
  return json({ data: { report: toReportView(report), version, classes, items, openDisputes: [...open] } });
});

/** Recomputes Doubts now (inline for small sets, otherwise a job). */
export const POST = route<P>(async (req, { params }) => {
  const access = await requireRole(parseId(params.projectId, "project"), "owner");
  await readJson(req, recomputeDoubtsSchema);
  const report = await startReportByProjectId({ projectId: access.project.id, kind: "doubts", userId: access.user.id, inlineMax: DOUBTS_INLINE_MAX, force: true });
  return json({ data: { report: toReportView(report) } }, { status: report.status === "succeeded" ? 201 : 202 });
});
