import { coefficient, describePercent, landisKochBand } from "./bands";
import { bootstrapIntervals } from "./bootstrap";
import { AgreementEngine, SLOT_ALPHA, SLOT_FLEISS, SLOT_PERCENT } from "./engine";
import { buildPatterns } from "./patterns";
import { wilsonProportion } from "./proportion";
import { labelQuality } from "./quality";
import type { AgreementInput, AgreementOptions, AgreementReport, AnnotatorAgreement, Coefficient, Interval, PairKappa } from "./types";
import { resolveOptions, validateInput } from "./validate";

const orNull = (v: number): number | null => (Number.isFinite(v) ? v : null);

/**
 * Every agreement figure of a project from long-format ratings, with percentile bootstrap 95% intervals
 * over items. Throws AgreementInputError on malformed input. The result is plain JSON-serialisable data.
 */
export function computeAgreement(input: AgreementInput, options?: AgreementOptions): AgreementReport {
  validateInput(input);
  const opts = resolveOptions(options);
  const patterns = buildPatterns(input, input.finalLabel);
  const engine = new AgreementEngine(patterns, input.classCount, input.annotatorCount);
  const point = new Float64Array(engine.valueCount);
  const intervals = bootstrapIntervals(engine, patterns, opts.resamples, opts.seed, opts.detailIntervals);
  // The point estimate runs last so the engine's accumulators hold the point counts read below.
  engine.evaluate(patterns.count, point, true);
  const quality = labelQuality(input);
  const noInterval = opts.resamples === 0 ? "intervals not computed" : undefined;
  const detailNoInterval = opts.resamples === 0 || !opts.detailIntervals ? "intervals not computed" : undefined;
  const coef = (symbol: string, slot: number): Coefficient =>
    coefficient(symbol, orNull(point[slot]), intervals[slot], slot < engine.slotPair ? noInterval : detailNoInterval);

  const cohenKappa: PairKappa[] = [];
  for (let id = 0; id < engine.pairCount; id += 1) {
    cohenKappa.push({ a: engine.pairA[id], b: engine.pairB[id], n: engine.pairN[id], kappa: coef("κ", engine.slotPair + id) });
  }
  cohenKappa.sort((x, y) => x.a - y.a || x.b - y.b);

  const perClass = Array.from({ length: input.classCount }, (_, c) => ({
    class: c,
    ratings: engine.classValues[c],
    alpha: coef("α", engine.slotClass + c),
  }));

  const perAnnotator: AnnotatorAgreement[] = [];
  for (let a = 0; a < input.annotatorCount; a += 1) {
    if (quality.ratingsByAnnotator[a] === 0) continue;
    perAnnotator.push({
      annotator: a,
      ratings: quality.ratingsByAnnotator[a],
      sharedItems: engine.sharedN[a],
      kappaVsOthers: coef("κ", engine.slotVsOthers + a),
      finalItems: engine.finalN[a],
      matchesFinal: wilsonProportion(engine.finalAgree[a], engine.finalN[a]),
      kappaVsFinal: coef("κ", engine.slotVsFinal + a),
      control: quality.controlByAnnotator[a],
      takeRate: quality.takeByAnnotator[a],
    });
  }

  const alpha = coef("α", SLOT_ALPHA);
  const percent = orNull(point[SLOT_PERCENT]);
  const percentCi: Interval | null = intervals[SLOT_PERCENT];
  return {
    items: patterns.ratedItems,
    pairableItems: engine.pairableWeight,
    annotators: perAnnotator.length,
    ratings: input.item.length,
    classes: input.classCount,
    percentAgreement: { value: percent, ci95: percentCi, band: null, reading: describePercent(percent, percentCi, noInterval) },
    krippendorffAlpha: alpha,
    fleissKappa: {
      ...coef("κ", SLOT_FLEISS),
      items: engine.fleissWeight,
      ratersPerItem: engine.fleissM > 0 ? engine.fleissM : null,
    },
    cohenKappa,
    perClass,
    perAnnotator,
    control: quality.control,
    suggestions: quality.suggestions,
    band: landisKochBand(alpha.value),
    reading: alpha.reading,
    bootstrap: { resamples: opts.resamples, seed: opts.seed, method: "percentile", level: 0.95, unit: "item" },
  };
}
