import "server-only";
import { presignGet } from "@/lib/storage/s3";
import { computeSuggestion, suggestionUnlessBlind, suggestionWithItem, type Suggestion } from "./suggestion";

export type { Suggestion, SuggestionNeighbour } from "./suggestion";
export { markKnnChanged } from "./version";
export { enqueuePoolRank, maybeEnqueuePoolRank } from "./pool-trigger";
export { clearEngineCache } from "./cache";
export { engineVersion } from "./engine-settings";

/** The Suggestion for an item (top class, every class's vote share, the neighbours), current as of knn_state.version. */
export async function getSuggestion(input: { projectId: number; itemId: number }): Promise<Suggestion> {
  return computeSuggestion(input, (key) => presignGet(key));
}

/** As getSuggestion, but null when the item is blind (its suggestion is withheld from annotators). */
export async function getSuggestionUnlessBlind(input: { projectId: number; itemId: number }): Promise<Suggestion | null> {
  return suggestionUnlessBlind(input, (key) => presignGet(key));
}

/** The item (as the Desk shows it) and its Suggestion in one go; the suggestion is null for a blind item. */
export async function getSuggestionWithItem(input: { projectId: number; itemId: number }) {
  return suggestionWithItem(input, (key) => presignGet(key), true);
}
