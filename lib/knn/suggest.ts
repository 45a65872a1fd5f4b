import type { ExactIndex } from "./exact-index";
import type { Suggestion, Weighting } from "./types";
import { vote } from "./vote";

export interface SuggestOptions {
  k: number;
  numClasses: number;
  weighting?: Weighting;
  /** The item being labelled, when it is itself in the index. */
  excludeId?: number;
}

/** The Desk's Suggestion for one query vector: top class, every class's vote share, the neighbours. */
export function suggest(index: ExactIndex, query: ArrayLike<number>, options: SuggestOptions): Suggestion {
  const neighbours = index.search(query, options.k, { excludeId: options.excludeId });
  return { ...vote(neighbours, options.numClasses, options.weighting ?? "uniform"), neighbours };
}
