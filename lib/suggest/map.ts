import { computeMap } from "@/lib/knn";
import { gridForK, mapSample } from "./map-grid";
import { loadProjectSet } from "./project-set";

/** The k values the Map's slider offers (the project's own k is added). */
export const MAP_KS = [1, 3, 5, 7, 9, 11, 15, 21, 31, 41, 51];
/** At or below this many items the page computes inline; above it a job runs. */
export const MAP_INLINE_MAX = 5_000;
/** Points sent to the browser for drawing (a seeded sample above this). */
export const MAP_MAX_POINTS = 10_000;
const SEED = 1;

export type MapReport = {
  method: string;
  sampling: string;
  explainedVariance: [number, number];
  items: number;
  voters: number;
  classIds: number[];
  /** Points for drawing: item id, x, y, class index of the final label (−1 = none yet). */
  points: Array<[number, number, number, number]>;
  grid: { size: number; xMin: number; xMax: number; yMin: number; yMax: number };
  /** Per k: each grid cell's region class index (−1 = no voter) and top share (0..100), row-major from yMin. */
  regions: Record<string, { classIndex: number[]; topShare: number[] }>;
  ks: number[];
  projectK: number;
};

/**
 * The Map of a project: lib/knn's computeMap (PCA + grid vote in the projected plane) at the
 * project's k, every point returned; the other ks of the slider reuse that projection (gridForK).
 */
export async function computeProjectMap(projectId: number, options: { onProgress?: (p: number) => Promise<void> | void } = {}): Promise<{ report: MapReport; knnVersion: number } | null> {
  const ps = await loadProjectSet(projectId, { includeNonVoters: true });
  if (!ps || ps.set.classes.length === 0) return null;
  const n = ps.set.classes.length;
  const projectK = ps.state.settings.k;
  const ks = [...new Set([...MAP_KS, projectK])].sort((a, b) => a - b);
  const weighting = ps.state.settings.weighting;
  const m = computeMap(ps.set, { k: projectK, weighting, maxPoints: n, seed: SEED });
  const regions: MapReport["regions"] = {};
  for (let i = 0; i < ks.length; i += 1) {
    const k = ks[i];
    const g =
      k === projectK
        ? { classIndex: m.grid.cells.map((c) => c.classIndex), topShare: m.grid.cells.map((c) => c.topShare) }
        : gridForK(m, { k, numClasses: ps.set.numClasses, weighting, seed: SEED });
    regions[String(k)] = { classIndex: g.classIndex, topShare: g.topShare.map((s) => Math.round(s * 100)) };
    await options.onProgress?.((i + 1) / ks.length);
  }
  const shown = mapSample(n, MAP_MAX_POINTS, SEED + 2);
  const round = (v: number) => Math.round(v * 1e4) / 1e4;
  const points = Array.from(shown, (r) => {
    const p = m.points[r];
    return [p.id, round(p.x), round(p.y), ps.finalClass[r]] as [number, number, number, number];
  });
  const sampling = m.sampling.replace(/; \d+ of \d+ points returned/, `; ${points.length} of ${n} points drawn`);
  return {
    knnVersion: ps.state.version,
    report: {
      method: m.method.replace(`a ${projectK}-NN`, "a k-NN"),
      sampling: `${sampling}. Points are coloured by their final label (grey: none yet); regions use the labels that vote.`,
      explainedVariance: m.explainedVariance,
      items: n,
      voters: ps.votersCount,
      classIds: ps.state.classIds,
      points,
      grid: { size: m.grid.size, xMin: m.grid.xMin, xMax: m.grid.xMax, yMin: m.grid.yMin, yMax: m.grid.yMax },
      regions,
      ks,
      projectK,
    },
  };
}
