import type { Distance, Weighting } from "./types";
import { leaveOneOutNeighbours, type LabelledSet } from "./tuning";
import { vote } from "./vote";

export interface Doubt {
  id: number;
  classIndex: number;
  /** Vote share of the item's own label among its k nearest voters, itself excluded. */
  ownShare: number;
  /** The neighbours' top class (−1 when nobody voted). */
  top: number;
}

/** Labelled items ranked by the share their own label gets from their neighbours, lowest first (ties: lower id). */
export function findDoubts(set: LabelledSet, options: { k: number; distance?: Distance; weighting?: Weighting }): Doubt[] {
  const ids = set.ids ?? Int32Array.from({ length: set.classes.length }, (_, i) => i);
  const { rows, neighbours } = leaveOneOutNeighbours(set, options.distance ?? "euclidean", options.k);
  const doubts = rows.map((row, i) => {
    const v = vote(neighbours[i], set.numClasses, options.weighting ?? "uniform");
    const own = set.classes[row];
    return { id: ids[row], classIndex: own, ownShare: v.shares[own], top: v.top };
  });
  return doubts.sort((a, b) => a.ownShare - b.ownShare || a.id - b.id);
}
