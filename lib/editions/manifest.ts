import type { AgreementReport, Coefficient } from "@/lib/agreement";
import type { StoredAgreement } from "@/lib/agreement-server/types";
import type { FeatureColumnPlan } from "./columns";
import type { EditionOptions, IncludeSource, SplitName } from "./options";
import type { EditionRow } from "./rows";

export type FileEntry = { name: string; bytes: number; sha256: string; contentType: string };

type CoefficientSummary = Pick<Coefficient, "value" | "ci95" | "band">;

export type AgreementSummary = {
  scope: "all live labels of the project at the snapshot";
  computedAt: string;
  knnVersion: number;
  labels: number;
  items: number;
  annotators: number;
  percentAgreement: CoefficientSummary;
  krippendorffAlpha: CoefficientSummary;
  fleissKappa: CoefficientSummary;
  band: AgreementReport["band"];
  reading: string;
  blind: { ratings: number; krippendorffAlpha: CoefficientSummary };
  control: AgreementReport["control"];
  bootstrap: AgreementReport["bootstrap"];
};

export type Counts = {
  rows: number;
  byClass: Record<string, number>;
  bySource: Record<IncludeSource, number>;
  bySplit: Record<SplitName, { rows: number; byClass: Record<string, number> }> | null;
  blind: number;
  control: number;
  annotators: number;
};

export type EditionManifest = {
  format: "vicinal-edition/1";
  project: { id: number; name: string };
  edition: number;
  editionId: number;
  createdBy: { id: string | null; email?: string };
  createdAt: string;
  snapshotAt: string;
  options: EditionOptions;
  classes: Array<{ id: number; name: string; colour: string }>;
  counts: Counts;
  knn: { version: number; k: unknown; distance: unknown; scaling: unknown; weighting: unknown; voters: unknown };
  agreement: AgreementSummary | null;
  featureSchema: unknown;
  featureColumns: Array<{ column: string; kind: FeatureColumnPlan["kind"] }>;
  annotatorIdentity: "id" | "email";
  split: { seed: number; fractions: { train: number; validation: number; test: number }; method: string } | null;
  files: { csv: FileEntry; jsonl: FileEntry; parquet: FileEntry };
  caution: string;
};

const pick = (c: Coefficient): CoefficientSummary => ({ value: c.value, ci95: c.ci95, band: c.band });

export function agreementSummary(stored: StoredAgreement): AgreementSummary {
  const o = stored.overall;
  return {
    scope: "all live labels of the project at the snapshot",
    computedAt: stored.computedAt,
    knnVersion: stored.knnVersion,
    labels: stored.labels,
    items: o.items,
    annotators: o.annotators,
    percentAgreement: pick(o.percentAgreement),
    krippendorffAlpha: pick(o.krippendorffAlpha),
    fleissKappa: pick(o.fleissKappa),
    band: o.band,
    reading: o.reading,
    blind: { ratings: stored.blind.ratings, krippendorffAlpha: pick(stored.blind.krippendorffAlpha) },
    control: o.control,
    bootstrap: o.bootstrap,
  };
}

export class CountTally {
  readonly counts: Counts;

  constructor(classNames: string[], split: boolean, annotators: number) {
    const zeros = () => Object.fromEntries(classNames.map((n) => [n, 0]));
    this.counts = {
      rows: 0,
      byClass: zeros(),
      bySource: { agreed: 0, ruling: 0, single: 0, control: 0, disputed: 0 },
      bySplit: split ? { train: { rows: 0, byClass: zeros() }, validation: { rows: 0, byClass: zeros() }, test: { rows: 0, byClass: zeros() } } : null,
      blind: 0,
      control: 0,
      annotators,
    };
  }

  add(row: EditionRow) {
    const c = this.counts;
    c.rows += 1;
    c.bySource[row.label_source] += 1;
    if (row.final_label !== null) c.byClass[row.final_label] = (c.byClass[row.final_label] ?? 0) + 1;
    if (row.is_blind) c.blind += 1;
    if (row.is_control) c.control += 1;
    if (c.bySplit && row.split) {
      const part = c.bySplit[row.split];
      part.rows += 1;
      if (row.final_label !== null) part.byClass[row.final_label] = (part.byClass[row.final_label] ?? 0) + 1;
    }
  }
}

export const personalDataCaution =
  "This edition records who labelled what (annotator ids, or e-mail addresses when the owner chose them) and may hold personal data from the items. Share it only with people entitled to it and keep it under your data-protection duties.";
