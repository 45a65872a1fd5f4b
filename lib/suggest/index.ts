import "server-only";
import { presignGet } from "@/lib/storage/s3";
import { computeSuggestion, suggestionWithItem, type Suggestion } from "./suggestion";

export type { Suggestion, SuggestionNeighbour } from "./suggestion";
export { markKnnChanged } from "./version";
export { enqueuePoolRank, maybeEnqueuePoolRank } from "./pool-trigger";
export { clearEngineCache } from "./cache";
export { engineVersion } from "./engine-settings";

/** The Suggestion for an item (top class, every class's vote share, the neighbours), current as of knn_state.version. */
export async function getSuggestion(input: { projectId: number; itemId: number }): Promise<Suggestion> {
  return computeSuggestion(input, (key) => presignGet(key));
}

/** The item (as the Desk shows it) and its Suggestion in one go; with `skipBlind`, the suggestion is null for a blind item. */
export async function getSuggestionWithItem(input: { projectId: number; itemId: number }, { skipBlind = true } = {}) {
  return suggestionWithItem(input, (key) => presignGet(key), skipBlind);
}
