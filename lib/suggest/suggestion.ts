import { pool } from "@/db";
import { suggest } from "@/lib/knn";
import { AppError } from "@/lib/errors";
import { engineVersion } from "./engine-settings";
import { clearEngineCache, getEngine } from "./cache";
import { hasFeatures, transformRows } from "./features";

export type SuggestionNeighbour = { itemId: number; externalId: string; classId: number; distance: number; fields: Record<string, unknown>; thumbUrl: string | null };
export type Suggestion = {
  itemId: number;
  topClassId: number | null;
  shares: Record<string, number>;
  k: number;
  distance: "euclidean" | "manhattan" | "cosine";
  weighting: "uniform" | "inverse";
  neighbours: SuggestionNeighbour[];
  votersCount: number;
  knnVersion: number;
  engineVersion: string;
};

/** Turns a thumbnail object key into a URL the browser can load (the app passes a presigner; the worker and tests need none). */
export type ThumbUrl = (key: string) => Promise<string>;

/** The Suggestion for one item of the project; 404 when the item belongs to another project. */
export async function computeSuggestion(input: { projectId: number; itemId: number }, thumbUrl?: ThumbUrl): Promise<Suggestion> {
  return (await suggestionUnlessBlind(input, thumbUrl, false))!;
}

/** As computeSuggestion, but null for a blind item when `skipBlind` (the item's flag is read with its vector, in the same query). */
export async function suggestionUnlessBlind(input: { projectId: number; itemId: number }, thumbUrl: ThumbUrl | undefined, skipBlind: boolean, retried = false): Promise<Suggestion | null> {
  const [entry, res] = await Promise.all([getEngine(input.projectId), pool.query({ name: "vicinal_suggest_item", text: "select id, project_id, vector, fields, is_blind from items where id = $1", values: [input.itemId] })]);
  const { state } = entry;
  const item = res.rows[0] as { id: number; project_id: number; vector: Buffer | null; fields: Record<string, unknown>; is_blind: boolean } | undefined;
  if (!item || item.project_id !== input.projectId) throw new AppError("not_found:item", "No such item in this project.");
  if (skipBlind && item.is_blind) return null;
  const { k, distance, weighting } = state.settings;
  const shares: Record<string, number> = Object.fromEntries(state.classIds.map((id) => [String(id), 0]));
  const base = { itemId: item.id, k, distance, weighting, knnVersion: state.version, engineVersion, votersCount: entry.index?.size ?? 0 };
  if (!entry.index || !entry.prep || !hasFeatures(state.schema, item)) return { ...base, topClassId: null, shares, neighbours: [] };
  const query = transformRows(state.schema, entry.prep.state, [item]);
  const s = suggest(entry.index, query, { k, numClasses: state.classIds.length, weighting, excludeId: item.id });
  state.classIds.forEach((id, c) => (shares[String(id)] = s.shares[c]));
  const ids = s.neighbours.map((n) => n.id);
  // By primary key only (a project_id condition can lead the planner to scan the project's items); the project is checked here.
  const info = await pool.query({ name: "vicinal_suggest_neighbours", text: "select id, project_id, external_id, fields, thumb_key from items where id = any($1::int[])", values: [ids] });
  const byId = new Map(info.rows.filter((r) => r.project_id === input.projectId).map((r) => [r.id as number, r]));
  if (byId.size !== ids.length && !retried) {
    // A neighbour vanished (item deleted): forget the index and answer once more from a fresh one.
    clearEngineCache(input.projectId);
    return suggestionUnlessBlind(input, thumbUrl, skipBlind, true);
  }
  const neighbours = await Promise.all(
    s.neighbours.map(async (n) => {
      const r = byId.get(n.id) ?? { external_id: String(n.id), fields: {}, thumb_key: null };
      return {
        itemId: n.id,
        externalId: r.external_id as string,
        classId: state.classIds[n.classIndex],
        distance: n.distance,
        fields: (r.fields as Record<string, unknown>) ?? {},
        thumbUrl: r.thumb_key && thumbUrl ? await thumbUrl(r.thumb_key as string) : null,
      };
    }),
  );
  return { ...base, topClassId: s.top >= 0 ? state.classIds[s.top] : null, shares, neighbours };
}
