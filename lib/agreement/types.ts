/**
 * Long-format ratings: rating r says annotator `annotator[r]` gave item `item[r]` the class `label[r]`.
 * Indices are 0-based and dense (0 ≤ item < itemCount, …). A missing rating is an absent entry.
 */
export interface RatingsInput {
  itemCount: number;
  annotatorCount: number;
  classCount: number;
  item: Int32Array;
  annotator: Int32Array;
  label: Int32Array;
}

export interface AgreementInput extends RatingsInput {
  /** Per item: the final (consensus or ruled) class, or -1 when the item has none yet. */
  finalLabel?: Int32Array;
  /** Per item: the known class of a control item, or -1 when the item is not a control item. */
  controlLabel?: Int32Array;
  /** Per rating: 1 when the annotator took the suggestion as it was shown. */
  tookSuggestion?: Uint8Array;
  /** Per rating: 1 when the label was given without a suggestion on screen (blind share). */
  blind?: Uint8Array;
  /** Per rating: the suggestion's top class at labelling time (also computed for blind labels), or -1. */
  suggestionTop?: Int32Array;
}

export interface AgreementOptions {
  /** Bootstrap resamples over items; 0 turns the intervals off. Default 1000. */
  resamples?: number;
  /** Seed of the resampling generator. Default 1. */
  seed?: number;
  /** Also give intervals for per-pair, per-class and per-annotator coefficients. Default true. */
  detailIntervals?: boolean;
}

export type BandName = "poor" | "slight" | "fair" | "moderate" | "substantial" | "almost perfect";

export interface Interval {
  lower: number;
  upper: number;
}

/** A chance-corrected coefficient (kappa or alpha) with its bootstrap interval and reading. */
export interface Coefficient {
  /** null when undefined for these data (e.g. only one class used, or no shared item). */
  value: number | null;
  /** Percentile bootstrap 95% interval over items; null when off or too few defined resamples. */
  ci95: Interval | null;
  band: BandName | null;
  reading: string;
}

/** A share of successes with a Wilson score 95% interval. */
export interface Proportion {
  successes: number;
  total: number;
  value: number | null;
  ci95: Interval | null;
}

export interface PairKappa {
  a: number;
  b: number;
  /** Items rated by both. */
  n: number;
  kappa: Coefficient;
}

export interface ClassAgreement {
  class: number;
  /** Ratings of this class on items with at least two ratings. */
  ratings: number;
  /** One-vs-rest nominal Krippendorff's alpha (this class against all others). */
  alpha: Coefficient;
}

export interface AnnotatorAgreement {
  annotator: number;
  ratings: number;
  /** Items this annotator rated that someone else rated too. */
  sharedItems: number;
  /** Pooled kappa of this annotator against the other raters of the same items (docs/agreement.md). */
  kappaVsOthers: Coefficient;
  /** Items this annotator rated that have a final label. */
  finalItems: number;
  matchesFinal: Proportion;
  kappaVsFinal: Coefficient;
  control: Proportion;
  /** Took the suggestion, among this annotator's labels with a suggestion shown. */
  takeRate: Proportion;
}

export interface SuggestionSide {
  labels: number;
  /** Suggestion's top class equals the final label (labels whose item has a final label and whose top class is known). */
  topClassAccuracy: Proportion;
  /** The annotator's label equals the suggestion's top class. */
  labelMatchesTop: Proportion;
}

export interface SuggestionQuality {
  takeRate: Proportion;
  /** Labels given without a suggestion on screen: the honest measure of suggestion accuracy. */
  blind: SuggestionSide;
  /** Labels given with the suggestion on screen: inflated by anchoring. */
  shown: SuggestionSide;
}

export interface AgreementReport {
  /** Items with at least one rating (the bootstrap's resampling units). */
  items: number;
  /** Items with at least two ratings. */
  pairableItems: number;
  annotators: number;
  ratings: number;
  classes: number;
  /** Mean over items with ≥ 2 ratings of the share of agreeing ordered pairs of ratings. */
  percentAgreement: Coefficient;
  krippendorffAlpha: Coefficient;
  fleissKappa: Coefficient & { items: number; ratersPerItem: number | null };
  cohenKappa: PairKappa[];
  perClass: ClassAgreement[];
  perAnnotator: AnnotatorAgreement[];
  control: Proportion;
  suggestions: SuggestionQuality | null;
  /** Headline: the band of Krippendorff's alpha. */
  band: BandName | null;
  reading: string;
  bootstrap: { resamples: number; seed: number; method: "percentile"; level: 0.95; unit: "item" };
}
