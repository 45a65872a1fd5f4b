import type { BandName, Coefficient, Interval } from "@/lib/agreement";
import type { ProjectAgreement } from "@/lib/agreement-server/cache";

export type SummaryFigure = {
  key: "alpha" | "alphaBlind" | "fleiss";
  label: string;
  symbol: "α" | "κ";
  value: number | null;
  ci95: Interval | null;
  band: BandName | null;
  reading: string;
  /** Items the figure rests on (items with ≥ 2 labels; for Fleiss, items with the modal label count). */
  items: number;
};

/** The answer of GET /api/v1/projects/{projectId}/dashboard/agreement. */
export type AgreementSummary = {
  projectId: number;
  status: "ready" | "computing";
  stale: boolean;
  queued: boolean;
  computedAt: string | null;
  labels: number;
  blindItems: number;
  /** The headline is always Krippendorff's alpha over all items, as on the Agreement page. */
  headline: SummaryFigure | null;
  figures: SummaryFigure[];
  percentAgreement: { value: number | null; ci95: Interval | null; reading: string } | null;
};

const figure = (key: SummaryFigure["key"], label: string, symbol: SummaryFigure["symbol"], c: Coefficient, items: number): SummaryFigure => ({
  key,
  label,
  symbol,
  value: c.value,
  ci95: c.ci95,
  band: c.band,
  reading: c.reading,
  items,
});

export function toAgreementSummary(projectId: number, found: ProjectAgreement): AgreementSummary {
  const base = { projectId, stale: found.stale, queued: found.queued };
  const s = found.stored;
  if (!s) return { ...base, status: "computing", computedAt: null, labels: 0, blindItems: 0, headline: null, figures: [], percentAgreement: null };
  const alpha = figure("alpha", "Krippendorff's alpha, all items", "α", s.overall.krippendorffAlpha, s.overall.pairableItems);
  return {
    ...base,
    status: "ready",
    computedAt: s.computedAt,
    labels: s.labels,
    blindItems: s.blindItems,
    headline: alpha,
    figures: [
      alpha,
      figure("alphaBlind", "Krippendorff's alpha, blind items", "α", s.blind.krippendorffAlpha, s.blind.pairableItems),
      figure("fleiss", "Fleiss' kappa", "κ", s.overall.fleissKappa, s.overall.fleissKappa.items),
    ],
    percentAgreement: { value: s.overall.percentAgreement.value, ci95: s.overall.percentAgreement.ci95, reading: s.overall.percentAgreement.reading },
  };
}
