/** Shapes the Desk and Disputes screens receive from the REST routes (JSON, dates as ISO strings). */
export type DeskClass = { id: number; name: string; colour: string; keyHint: number };
export type DeskColumn = { name: string; kind: "numeric" | "categorical" | "vector"; unit?: string };
// The item and its Suggestion are typed where the server builds them (type-only imports: no server code reaches the browser).
export type { SuggestionNeighbour as DeskNeighbour } from "@/lib/suggest/suggestion";
export type { DeskItem, DeskSuggestion } from "@/lib/labelling/desk-item";
export type DeskStats = { doneToday: number; doneTotal: number; remainingItems: number; openSlots: number; remainingForYou: number; overlap: number; undoWindowSeconds: number };
