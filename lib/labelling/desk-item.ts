import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { items, type Item, type SuggestionSnapshot } from "@/db/schema";
import { presignGet } from "@/lib/storage/s3";
import { getSuggestion, type Suggestion } from "@/lib/suggest";
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

export async function getItemInProject(projectId: number, itemId: number) {
  const [item] = await db.select().from(items).where(and(eq(items.id, itemId), eq(items.projectId, projectId)));
  return item ?? null;
}

export async function buildDeskItem({ projectId, itemId, userId, leasedUntil }: { projectId: number; itemId: number; userId: string; leasedUntil: Date }): Promise<DeskItem | null> {
  const item = await getItemInProject(projectId, itemId);
  if (!item) return null;
  const [url, s] = await Promise.all([itemImageUrl(item), item.isBlind ? Promise.resolve(null) : safeSuggestion(projectId, itemId)]);
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
