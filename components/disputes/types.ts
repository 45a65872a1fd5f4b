import type { DeskNeighbour } from "@/components/desk/types";

export type DisputeLabel = { labelId: number; classId: number; annotatorId: string; annotatorName: string | null; tookSuggestion: boolean; suggestion: { shown: boolean; topClassId: number | null } | null; createdAt: string };
export type DisputeRow = {
  id: number;
  itemId: number;
  externalId: string;
  reason: "disagreement" | "doubt";
  status: "open" | "ruled";
  note: string | null;
  openedAt: string;
  closedAt: string | null;
  itemStatus: string;
  finalClassId: number | null;
  finalSource: string | null;
  classIds: number[];
  labels: DisputeLabel[];
};
export type DisputeList = { data: DisputeRow[]; total: number; pairs: Array<{ a: number; b: number; n: number }>; next: string | null };
export type Ruling = { id: number; disputeId: number; classId: number; className: string; reason: string; reviewerId: string; reviewerName: string | null; createdAt: string };
export type DisputeDetail = {
  dispute: DisputeRow;
  item: { id: number; externalId: string; fields: Record<string, unknown>; imageUrl: string | null; isControl: boolean; isBlind: boolean };
  flags: Array<{ kind: "skip" | "flag"; comment: string | null; name: string | null; createdAt: string }>;
  suggestion: { topClassId: number | null; shares: Record<string, number>; k: number; distance: string; neighbours: DeskNeighbour[]; votersCount: number } | null;
  ruling: Ruling | null;
};
