import type { AgreementReport, AnnotatorAgreement, ClassAgreement, PairKappa } from "@/lib/agreement";

/** Label counts behind the suggestion figures. */
export type SuggestionCounts = {
  /** Labels given with the suggestion on screen. */
  shown: number;
  /** Labels given without it but with a hidden suggestion stored (blind items). */
  hidden: number;
  /** Labels given when no suggestion could be made (e.g. too few labelled neighbours yet). */
  none: number;
};

/** What the reports table caches per project (kind "agreement"): indices of the reports refer to the id lists. */
export type StoredAgreement = {
  format: 1;
  knnVersion: number;
  computedAt: string;
  seconds: number;
  labels: number;
  blindItems: number;
  annotatorIds: string[];
  classIds: number[];
  suggestionCounts: SuggestionCounts;
  overall: AgreementReport;
  /** The same figures on labels of blind items only. */
  blind: AgreementReport;
};

export type AnnotatorRef = {
  index: number;
  /** The user id; null when the caller may not see who annotated. */
  id: string | null;
  name: string;
  you: boolean;
};

export type ClassRef = { index: number; id: number; name: string; colour: string };

export type PairView = Omit<PairKappa, "a" | "b"> & { a: AnnotatorRef; b: AnnotatorRef };
export type ClassView = Omit<ClassAgreement, "class"> & { class: ClassRef };
export type AnnotatorView = Omit<AnnotatorAgreement, "annotator"> & { annotator: AnnotatorRef };

export type ReportView = Omit<AgreementReport, "cohenKappa" | "perClass" | "perAnnotator"> & {
  cohenKappa: PairView[];
  perClass: ClassView[];
  perAnnotator: AnnotatorView[];
};

/** The answer of GET /api/v1/projects/{projectId}/agreement. */
export type AgreementView = {
  projectId: number;
  /** "ready": a report is shown; "computing": none yet, a background job is making one. */
  status: "ready" | "computing";
  /** The report predates the latest label change (a fresh one is being computed in the background). */
  stale: boolean;
  /** A background job has been queued for the current labels. */
  queued: boolean;
  currentVersion: number;
  namesVisible: boolean;
  report: {
    knnVersion: number;
    computedAt: string;
    seconds: number;
    labels: number;
    blindItems: number;
    suggestionCounts: SuggestionCounts;
    annotators: AnnotatorRef[];
    classes: ClassRef[];
    overall: ReportView;
    blind: ReportView;
  } | null;
};
