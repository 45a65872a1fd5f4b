import type { LabelledSet } from "@/lib/knn";
import { categoricalColumns, ensurePreprocessor, hasFeatures, transformRows } from "./features";
import { readEngineState, type EngineState } from "./state";
import { queryVotingRows } from "./voting-sql";

export type ProjectSet = {
  state: EngineState;
  /** Every loaded row (voters, plus the others when asked), preprocessed; classes −1 = does not vote. */
  set: LabelledSet & { ids: Int32Array };
  status: string[];
  /** Class index of items.final_class_id per row (−1 when none). */
  finalClass: Int32Array;
  votersCount: number;
  fittedOn: number;
  sampledFit: boolean;
};

/** Loads the project's items with the same preprocessing and voting rules as the Suggestion (for jobs: pool, tuning, doubts, map). */
export async function loadProjectSet(projectId: number, options: { includeNonVoters: boolean }): Promise<ProjectSet | null> {
  const state = await readEngineState(projectId);
  const hasSchema = (state.schema?.dimension ?? 0) > 0 || (state.schema?.columns ?? []).some((c) => c.kind === "categorical");
  if (!hasSchema) return null;
  const prep = await ensurePreprocessor(projectId, state.settings, state.schema, state.maxSeq);
  if (prep.state.width === 0) return null;
  const classIndex = new Map(state.classIds.map((id, i) => [id, i]));
  const rows = (await queryVotingRows(projectId, state.settings, { kind: options.includeNonVoters ? "all" : "voters" }, categoricalColumns(state.schema))).filter((r) => hasFeatures(state.schema, r));
  const vectors = transformRows(state.schema, prep.state, rows);
  const classes = Int32Array.from(rows, (r) => (r.voteClassId === null ? -1 : classIndex.get(r.voteClassId) ?? -1));
  const ids = Int32Array.from(rows, (r) => r.id);
  const finalClass = Int32Array.from(rows, (r) => (r.finalClassId === null ? -1 : classIndex.get(r.finalClassId) ?? -1));
  let votersCount = 0;
  for (const c of classes) if (c >= 0) votersCount += 1;
  return {
    state,
    set: { vectors, dim: prep.state.width, classes, ids, numClasses: state.classIds.length },
    status: rows.map((r) => r.status),
    finalClass,
    votersCount,
    fittedOn: prep.fittedOn,
    sampledFit: prep.sampled,
  };
}

/** Only the rows of `ps` whose class is ≥ 0 (the voters), as a LabelledSet. */
export function votersOnly(ps: ProjectSet): LabelledSet & { ids: Int32Array } {
  const { set } = ps;
  const keep: number[] = [];
  for (let i = 0; i < set.classes.length; i += 1) if (set.classes[i] >= 0) keep.push(i);
  if (keep.length === set.classes.length) return set;
  const d = set.dim;
  const vectors = new Float32Array(keep.length * d);
  keep.forEach((r, i) => vectors.set(set.vectors.subarray(r * d, (r + 1) * d), i * d));
  return { vectors, dim: d, classes: Int32Array.from(keep, (r) => set.classes[r]), ids: Int32Array.from(keep, (r) => set.ids[r]), numClasses: set.numClasses };
}
