export const distances = ["euclidean", "manhattan", "cosine"] as const;
export type Distance = (typeof distances)[number];

export const weightings = ["uniform", "inverse"] as const;
export type Weighting = (typeof weightings)[number];

export const scalings = ["zscore", "minmax", "none"] as const;
export type Scaling = (typeof scalings)[number];

/** One neighbour of a query: the item id, its class index (−1 = does not vote) and its distance. */
export interface Neighbour {
  id: number;
  classIndex: number;
  distance: number;
}

/** A vote over the label set: `top` is a class index (−1 when nobody voted), `shares[c]` sums to 1. */
export interface Vote {
  top: number;
  shares: Float64Array;
}

export interface Suggestion extends Vote {
  neighbours: Neighbour[];
}
