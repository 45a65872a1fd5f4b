import { ExactIndex, vote, type Neighbour } from "@/lib/knn";
import { ClusterIndex } from "@/lib/knn/cluster-index";
import { loadProjectSet, votersOnly } from "./project-set";

/** Items listed: own-label share below this (the label lacks a majority among its neighbours)… */
export const DOUBT_SHARE_BELOW = 0.5;
/** …at most this many, lowest share first. */
export const DOUBTS_LISTED = 200;
/** At or below this many voters the page computes inline; above it a job runs. */
export const DOUBTS_INLINE_MAX = 5_000;
/** Voters above which the search uses the cluster-pruned exact index (same answers as the plain scan). */
const CLUSTER_FROM = 20_000;

export type DoubtRow = {
  itemId: number;
  classId: number;
  ownShare: number;
  topClassId: number | null;
  shares: Record<string, number>;
  neighbours: Array<{ itemId: number; classId: number; distance: number }>;
};

export type DoubtsReport = { k: number; distance: string; weighting: string; voters: number; below: number; listed: number; shareBelow: number; doubts: DoubtRow[] };

/**
 * Doubts: each labelled item's own label's vote share among its k nearest voters (itself excluded),
 * lowest first; ties by lower item id (the order of lib/knn's findDoubts). Exact search throughout.
 */
export async function computeDoubts(projectId: number, options: { onProgress?: (p: number) => Promise<void> | void } = {}): Promise<{ report: DoubtsReport; knnVersion: number } | null> {
  const ps = await loadProjectSet(projectId, { includeNonVoters: false });
  if (!ps) return null;
  const set = votersOnly(ps);
  const { k, distance, weighting } = ps.state.settings;
  const n = set.classes.length;
  const classIds = ps.state.classIds;
  const index = n >= CLUSTER_FROM ? ClusterIndex.build(set.vectors, set.dim, set.ids, set.classes, distance) : ExactIndex.from(set.vectors, set.dim, set.classes, distance, set.ids);
  const all: Array<{ row: number; own: number; neighbours: Neighbour[]; top: number; shares: Float64Array }> = [];
  for (let r = 0; r < n; r += 1) {
    const q = set.vectors.subarray(r * set.dim, (r + 1) * set.dim);
    const neighbours = index instanceof ClusterIndex ? index.search(q, k, set.ids[r]) : index.search(q, k, { excludeId: set.ids[r] });
    const v = vote(neighbours, set.numClasses, weighting);
    all.push({ row: r, own: v.shares[set.classes[r]], neighbours, top: v.top, shares: v.shares });
    if ((r + 1) % 1000 === 0) await options.onProgress?.((r + 1) / n);
  }
  all.sort((a, b) => a.own - b.own || set.ids[a.row] - set.ids[b.row]);
  const below = all.filter((d) => d.own < DOUBT_SHARE_BELOW);
  const doubts = below.slice(0, DOUBTS_LISTED).map((d) => ({
    itemId: set.ids[d.row],
    classId: classIds[set.classes[d.row]],
    ownShare: d.own,
    topClassId: d.top >= 0 ? classIds[d.top] : null,
    shares: Object.fromEntries(classIds.map((id, c) => [String(id), d.shares[c]])),
    neighbours: d.neighbours.map((nb) => ({ itemId: nb.id, classId: classIds[nb.classIndex], distance: nb.distance })),
  }));
  return { knnVersion: ps.state.version, report: { k, distance, weighting, voters: n, below: below.length, listed: doubts.length, shareBelow: DOUBT_SHARE_BELOW, doubts } };
}
