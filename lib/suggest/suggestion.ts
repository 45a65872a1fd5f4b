import { LRUCache } from "lru-cache";
import { pool } from "@/db";
import { suggest } from "@/lib/knn";
import { AppError } from "@/lib/errors";
import { engineVersion } from "./engine-settings";
import { clearEngineCache, getEngineWithItem } from "./cache";
import { hasFeatures, transformRows } from "./features";
import type { StateItem } from "./state";

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

type Brief = { projectId: number; externalId: string; fields: Record<string, unknown>; thumbKey: string | null };

/**
 * What a neighbour shows (id, fields, thumbnail), per process. An item's fields never change after its import, and items
 * leave only with their project, so a cached brief stays true; the cache is bounded by the size of the fields it holds.
 */
const briefs = new LRUCache<number, Brief>({ maxSize: 64 * 1024 * 1024, sizeCalculation: (b) => 64 + b.externalId.length + JSON.stringify(b.fields).length });

/** The briefs of these items of this project (one query for those not cached; by primary key, the project checked here). */
async function neighbourBriefs(projectId: number, ids: number[]): Promise<Map<number, Brief>> {
  const out = new Map<number, Brief>();
  const missing: number[] = [];
  for (const id of ids) {
    const b = briefs.get(id);
    if (b) out.set(id, b);
    else missing.push(id);
  }
  if (missing.length) {
    // By primary key only (a project_id condition can lead the planner to scan the project's items).
    const res = await pool.query({ name: "vicinal_suggest_neighbours", text: "select id, project_id, external_id, fields, thumb_key from items where id = any($1::int[])", values: [missing] });
    for (const r of res.rows) {
      const b: Brief = { projectId: r.project_id, externalId: r.external_id, fields: r.fields ?? {}, thumbKey: r.thumb_key ?? null };
      briefs.set(r.id, b);
      out.set(r.id, b);
    }
  }
  for (const [id, b] of out) if (b.projectId !== projectId) out.delete(id);
  return out;
}

/** The Suggestion for one item of the project; 404 when the item belongs to another project. */
export async function computeSuggestion(input: { projectId: number; itemId: number }, thumbUrl?: ThumbUrl): Promise<Suggestion> {
  return (await suggestionWithItem(input, thumbUrl, false)).suggestion!;
}

/**
 * The Suggestion and the item it is for, which comes in the same round trip as the engine's version check (so a Desk
 * item costs no separate item query); with `skipBlind`, a blind item's suggestion is null.
 */
export async function suggestionWithItem(
  input: { projectId: number; itemId: number },
  thumbUrl: ThumbUrl | undefined,
  skipBlind: boolean,
  retried = false,
): Promise<{ item: StateItem; suggestion: Suggestion | null }> {
  const { entry, item } = await getEngineWithItem(input.projectId, input.itemId);
  const { state } = entry;
  // By primary key, then the project check here: a project_id condition can make the planner scan the project's items.
  if (!item || item.projectId !== input.projectId) throw new AppError("not_found:item", "No such item in this project.");
  if (skipBlind && item.isBlind) return { item, suggestion: null };
  const { k, distance, weighting } = state.settings;
  const shares: Record<string, number> = Object.fromEntries(state.classIds.map((id) => [String(id), 0]));
  const base = { itemId: item.id, k, distance, weighting, knnVersion: state.version, engineVersion, votersCount: entry.index?.size ?? 0 };
  if (!entry.index || !entry.prep || !hasFeatures(state.schema, item)) return { item, suggestion: { ...base, topClassId: null, shares, neighbours: [] } };
  const query = transformRows(state.schema, entry.prep.state, [item]);
  const s = suggest(entry.index, query, { k, numClasses: state.classIds.length, weighting, excludeId: item.id });
  state.classIds.forEach((id, c) => (shares[String(id)] = s.shares[c]));
  const ids = s.neighbours.map((n) => n.id);
  const byId = await neighbourBriefs(input.projectId, ids);
  if (byId.size !== ids.length && !retried) {
    // A neighbour vanished (item deleted): forget the index and answer once more from a fresh one.
    clearEngineCache(input.projectId);
    return suggestionWithItem(input, thumbUrl, skipBlind, true);
  }
  const neighbours = await Promise.all(
    s.neighbours.map(async (n) => {
      const r = byId.get(n.id) ?? { projectId: input.projectId, externalId: String(n.id), fields: {}, thumbKey: null };
      return {
        itemId: n.id,
        externalId: r.externalId,
        classId: state.classIds[n.classIndex],
        distance: n.distance,
        fields: r.fields,
        thumbUrl: r.thumbKey && thumbUrl ? await thumbUrl(r.thumbKey) : null,
      };
    }),
  );
  return { item, suggestion: { ...base, topClassId: s.top >= 0 ? state.classIds[s.top] : null, shares, neighbours } };
}
