import { wilsonProportion } from "./proportion";
import type { AgreementInput, Proportion, SuggestionQuality, SuggestionSide } from "./types";

export interface LabelQuality {
  ratingsByAnnotator: Float64Array;
  controlByAnnotator: Proportion[];
  control: Proportion;
  takeByAnnotator: Proportion[];
  suggestions: SuggestionQuality | null;
}

interface SideCounts {
  labels: number;
  topKnown: number;
  topCorrect: number;
  withTop: number;
  matchesTop: number;
}

function side(c: SideCounts): SuggestionSide {
  return {
    labels: c.labels,
    topClassAccuracy: wilsonProportion(c.topCorrect, c.topKnown),
    labelMatchesTop: wilsonProportion(c.matchesTop, c.withTop),
  };
}

/** Per-label counts: control-item accuracy, take-rate, suggestion accuracy on blind and shown labels. */
export function labelQuality(input: AgreementInput): LabelQuality {
  const { item, annotator, label, annotatorCount, controlLabel, finalLabel, tookSuggestion, blind, suggestionTop } = input;
  const ratingsByAnnotator = new Float64Array(annotatorCount);
  const controlTotal = new Float64Array(annotatorCount);
  const controlRight = new Float64Array(annotatorCount);
  const shownTotal = new Float64Array(annotatorCount);
  const took = new Float64Array(annotatorCount);
  const blindSide: SideCounts = { labels: 0, topKnown: 0, topCorrect: 0, withTop: 0, matchesTop: 0 };
  const shownSide: SideCounts = { labels: 0, topKnown: 0, topCorrect: 0, withTop: 0, matchesTop: 0 };
  for (let r = 0; r < item.length; r += 1) {
    const a = annotator[r];
    ratingsByAnnotator[a] += 1;
    const known = controlLabel ? controlLabel[item[r]] : -1;
    if (known >= 0) {
      controlTotal[a] += 1;
      if (label[r] === known) controlRight[a] += 1;
    }
    const isBlind = blind ? blind[r] === 1 : false;
    if (!isBlind) {
      shownTotal[a] += 1;
      if (tookSuggestion && tookSuggestion[r] === 1) took[a] += 1;
    }
    const counts = isBlind ? blindSide : shownSide;
    counts.labels += 1;
    const top = suggestionTop ? suggestionTop[r] : -1;
    if (top >= 0) {
      counts.withTop += 1;
      if (label[r] === top) counts.matchesTop += 1;
      const fin = finalLabel ? finalLabel[item[r]] : -1;
      if (fin >= 0) {
        counts.topKnown += 1;
        if (top === fin) counts.topCorrect += 1;
      }
    }
  }
  const controlByAnnotator: Proportion[] = [];
  const takeByAnnotator: Proportion[] = [];
  let controlSum = 0;
  let controlRightSum = 0;
  let shownSum = 0;
  let tookSum = 0;
  for (let a = 0; a < annotatorCount; a += 1) {
    controlByAnnotator.push(wilsonProportion(controlRight[a], controlTotal[a]));
    controlSum += controlTotal[a];
    controlRightSum += controlRight[a];
    const takeTotal = tookSuggestion ? shownTotal[a] : 0;
    takeByAnnotator.push(wilsonProportion(took[a], takeTotal));
    shownSum += takeTotal;
    tookSum += took[a];
  }
  const hasSuggestionData = tookSuggestion !== undefined || blind !== undefined || suggestionTop !== undefined;
  return {
    ratingsByAnnotator,
    controlByAnnotator,
    control: wilsonProportion(controlRightSum, controlSum),
    takeByAnnotator,
    suggestions: hasSuggestionData
      ? { takeRate: wilsonProportion(tookSum, shownSum), blind: side(blindSide), shown: side(shownSide) }
      : null,
  };
}
