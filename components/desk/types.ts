/** Shapes the Desk and Disputes screens receive from the REST routes (JSON, dates as ISO strings). */
export type DeskClass = { id: number; name: string; colour: string; keyHint: number };
export type DeskColumn = { name: string; kind: "numeric" | "categorical" | "vector"; unit?: string };
export type DeskNeighbour = { itemId: number; externalId: string; classId: number; distance: number; fields: Record<string, unknown>; thumbUrl: string | null };
export type DeskSuggestion = {
  topClassId: number | null;
  shares: Record<string, number>;
  k: number;
  distance: string;
  weighting: string;
  neighbours: DeskNeighbour[];
  votersCount: number;
};
export type DeskItem = {
  itemId: number;
  externalId: string;
  fields: Record<string, unknown>;
  imageUrl: string | null;
  leasedUntil: string;
  suggestion: DeskSuggestion | null;
  suggestionToken: string | null;
};
export type DeskStats = { doneToday: number; doneTotal: number; remainingItems: number; openSlots: number; remainingForYou: number; overlap: number; undoWindowSeconds: number };
