import type { AgreementInput } from "@/lib/agreement";
import { parseRecords } from "./parse";
import type { SuggestionCounts } from "./types";

export type AgreementRows = { labels: number; labelText: string; itemText: string; annotatorIds: string[]; classIds: number[] };

export const FLAG_TOOK = 1;
export const FLAG_SHOWN = 2;
export const FLAG_SNAPSHOT = 4;

export type ProjectInputs = { overall: AgreementInput; blind: AgreementInput; blindItems: number; suggestionCounts: SuggestionCounts };

/**
 * Typed arrays for lib/agreement from the compact SQL rows. A label counts as blind for the suggestion
 * figures when no suggestion was on screen; its stored hidden suggestion still gives the top class.
 * The blind subset keeps the same indices and takes only labels of items marked blind.
 */
export function buildAgreementInputs(rows: AgreementRows): ProjectInputs {
  const n = rows.labels;
  const [item, annotator, label, flags, top] = parseRecords(rows.labelText, 5, n);
  const itemCount = countRecords(rows.itemText);
  const [itemIdx, itemBlind, known, final] = parseRecords(rows.itemText, 4, itemCount);
  const finalLabel = new Int32Array(itemCount).fill(-1);
  const controlLabel = new Int32Array(itemCount).fill(-1);
  const isBlindItem = new Uint8Array(itemCount);
  let blindItems = 0;
  for (let i = 0; i < itemCount; i += 1) {
    const at = itemIdx[i];
    finalLabel[at] = final[i];
    controlLabel[at] = known[i];
    isBlindItem[at] = itemBlind[i];
    blindItems += itemBlind[i];
  }
  const tookSuggestion = new Uint8Array(n);
  const blind = new Uint8Array(n);
  const counts: SuggestionCounts = { shown: 0, hidden: 0, none: 0 };
  let blindRatings = 0;
  for (let r = 0; r < n; r += 1) {
    const f = flags[r];
    const shown = (f & FLAG_SHOWN) !== 0;
    tookSuggestion[r] = shown && (f & FLAG_TOOK) !== 0 ? 1 : 0;
    blind[r] = shown ? 0 : 1;
    if (shown) counts.shown += 1;
    else if ((f & FLAG_SNAPSHOT) !== 0 && top[r] >= 0) counts.hidden += 1;
    else counts.none += 1;
    blindRatings += isBlindItem[item[r]];
  }
  const base = { itemCount, annotatorCount: rows.annotatorIds.length, classCount: rows.classIds.length, finalLabel, controlLabel };
  const overall: AgreementInput = { ...base, item, annotator, label, tookSuggestion, blind, suggestionTop: top };
  const pick = <T extends Int32Array | Uint8Array>(src: T): T => {
    const out = new (src.constructor as new (length: number) => T)(blindRatings);
    let j = 0;
    for (let r = 0; r < n; r += 1) if (isBlindItem[item[r]]) out[j++] = src[r];
    return out;
  };
  const blindInput: AgreementInput = {
    ...base,
    item: pick(item),
    annotator: pick(annotator),
    label: pick(label),
    tookSuggestion: pick(tookSuggestion),
    blind: pick(blind),
    suggestionTop: pick(top),
  };
  return { overall, blind: blindInput, blindItems, suggestionCounts: counts };
}

function countRecords(text: string): number {
  if (text.length === 0) return 0;
  let count = 1;
  for (let i = 0; i < text.length; i += 1) if (text.charCodeAt(i) === 59) count += 1;
  return count;
}
