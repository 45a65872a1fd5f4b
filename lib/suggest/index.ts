import "server-only";
import { presignGet } from "@/lib/storage/s3";
import { computeSuggestion, type Suggestion } from "./suggestion";

export type { Suggestion, SuggestionNeighbour } from "./suggestion";
export { bumpKnnVersion } from "./version";
export { enqueuePoolRank, maybeEnqueuePoolRank } from "./pool-trigger";
export { clearEngineCache } from "./cache";
export { engineVersion } from "./engine-settings";

/** The Suggestion for an item (top class, every class's vote share, the neighbours), current as of knn_state.version. */
export async function getSuggestion(input: { projectId: number; itemId: number }): Promise<Suggestion> {
  return computeSuggestion(input, (key) => presignGet(key));
}
