import type { AgreementReport } from "@/lib/agreement";
import type { AgreementView, AnnotatorRef, ClassRef, ReportView } from "./types";
import type { ProjectAgreement } from "./cache";

export type NameBook = {
  classes: Array<{ id: number; name: string; colour: string }>;
  users: Array<{ id: string; name: string | null; email: string }>;
};

export type Audience = { userId: string; namesVisible: boolean };

/** Report indices back to classes and annotators; callers without names see "Annotator 1, 2, …". */
export function toAgreementView(projectId: number, found: ProjectAgreement, names: NameBook, audience: Audience): AgreementView {
  const base = { projectId, stale: found.stale, queued: found.queued, currentVersion: found.currentVersion, namesVisible: audience.namesVisible };
  const stored = found.stored;
  if (!stored) return { ...base, status: "computing", report: null };
  const classById = new Map(names.classes.map((c) => [c.id, c]));
  const userById = new Map(names.users.map((u) => [u.id, u]));
  const classes: ClassRef[] = stored.classIds.map((id, index) => {
    const c = classById.get(id);
    return { index, id, name: c?.name ?? `Class ${index + 1} (removed)`, colour: c?.colour ?? "#6b7282" };
  });
  const annotators: AnnotatorRef[] = stored.annotatorIds.map((id, index) => {
    const you = id === audience.userId;
    if (!audience.namesVisible) return { index, id: null, name: `Annotator ${index + 1}`, you };
    const u = userById.get(id);
    return { index, id, name: u?.name || u?.email.split("@")[0] || `Former member ${index + 1}`, you };
  });
  return {
    ...base,
    status: "ready",
    report: {
      knnVersion: stored.knnVersion,
      computedAt: stored.computedAt,
      seconds: stored.seconds,
      labels: stored.labels,
      blindItems: stored.blindItems,
      suggestionCounts: stored.suggestionCounts,
      annotators,
      classes,
      overall: mapReport(stored.overall, annotators, classes),
      blind: mapReport(stored.blind, annotators, classes),
    },
  };
}

function mapReport(r: AgreementReport, annotators: AnnotatorRef[], classes: ClassRef[]): ReportView {
  return {
    ...r,
    cohenKappa: r.cohenKappa.map((p) => ({ ...p, a: annotators[p.a], b: annotators[p.b] })),
    perClass: r.perClass.map((c) => ({ ...c, class: classes[c.class] })),
    perAnnotator: r.perAnnotator.map((a) => ({ ...a, annotator: annotators[a.annotator] })),
  };
}
