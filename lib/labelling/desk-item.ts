import "server-only";
import { named, pool } from "@/db";
import type { Item, SuggestionSnapshot } from "@/db/schema";
import { presignGet } from "@/lib/storage/s3";
import { AppError } from "@/lib/errors";
import { getSuggestion, getSuggestionWithItem, type Suggestion } from "@/lib/suggest";
import { signSnapshot } from "./snapshot";

export type DeskSuggestion = Pick<Suggestion, "topClassId" | "shares" | "k" | "distance" | "weighting" | "neighbours" | "votersCount">;

/** One Desk item as the annotator sees it. Blind items carry `suggestion: null`, like any item without one. */
export type DeskItem = {
  itemId: number;
  externalId: string;
  fields: Record<string, unknown>;
  imageUrl: string | null;
  leasedUntil: string;
  suggestion: DeskSuggestion | null;
  suggestionToken: string | null;
};

export function snapshotOf(s: Suggestion, shown: boolean): SuggestionSnapshot {
  return { shown, topClassId: s.topClassId, shares: s.shares, k: s.k, distance: s.distance, engineVersion: s.engineVersion, knnVersion: s.knnVersion };
}

/** The live suggestion for an item, or null when the engine cannot give one (never fails the caller). */
export async function safeSuggestion(projectId: number, itemId: number): Promise<Suggestion | null> {
  try {
    return await getSuggestion({ projectId, itemId });
  } catch (error) {
    console.error(`[desk] no suggestion for item ${itemId}:`, (error as Error).message);
    return null;
  }
}

/** The hidden suggestion stored with a blind label (shown = false), so its accuracy can be measured later. */
export async function blindSnapshotFor(projectId: number, itemId: number): Promise<SuggestionSnapshot | null> {
  const s = await safeSuggestion(projectId, itemId);
  return s ? snapshotOf(s, false) : null;
}

export async function itemImageUrl(item: Pick<Item, "imageKey" | "thumbKey">): Promise<string | null> {
  const key = item.imageKey ?? item.thumbKey;
  if (!key) return null;
  try {
    return await presignGet(key);
  } catch {
    return null;
  }
}

/** What the Desk, the label route and the dispute view need of an item (not its vector or scores); a named statement on the hot path. */
export async function getItemInProject(projectId: number, itemId: number) {
  const res = await named<{ id: number; external_id: string; fields: Record<string, unknown>; image_key: string | null; thumb_key: string | null; is_control: boolean; is_blind: boolean }>(
    pool,
    "vicinal_item_in_project",
    "select id, external_id, fields, image_key, thumb_key, is_control, is_blind from items where id = $1 and project_id = $2",
    [itemId, projectId],
  );
  const r = res.rows[0];
  return r ? { id: r.id, externalId: r.external_id, fields: r.fields, imageKey: r.image_key, thumbKey: r.thumb_key, isControl: r.is_control, isBlind: r.is_blind } : null;
}

export async function buildDeskItem({ projectId, itemId, userId, leasedUntil }: { projectId: number; itemId: number; userId: string; leasedUntil: Date }): Promise<DeskItem | null> {
  // The item comes with its suggestion (read in the engine's own version check; withheld for blind items). Should the
  // engine fail, the item is read alone and shown without one.
  let item: Pick<Item, "id" | "externalId" | "fields" | "imageKey" | "thumbKey"> | null;
  let s: Suggestion | null;
  try {
    ({ item, suggestion: s } = await getSuggestionWithItem({ projectId, itemId }));
  } catch (error) {
    if (!(error instanceof AppError && error.code === "not_found:item")) console.error(`[desk] no suggestion for item ${itemId}:`, (error as Error).message);
    [item, s] = [await getItemInProject(projectId, itemId), null];
  }
  if (!item) return null;
  const url = await itemImageUrl(item);
  return {
    itemId: item.id,
    externalId: item.externalId,
    fields: item.fields,
    imageUrl: url,
    leasedUntil: leasedUntil.toISOString(),
    suggestion: s ? { topClassId: s.topClassId, shares: s.shares, k: s.k, distance: s.distance, weighting: s.weighting, neighbours: s.neighbours, votersCount: s.votersCount } : null,
    suggestionToken: s ? signSnapshot(item.id, userId, snapshotOf(s, true)) : null,
  };
}
