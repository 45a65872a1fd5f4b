import type { DeskNeighbour } from "@/components/desk/types";
import type { DisputeRow } from "@/db/queries/disputes";

// Typed where the server reads them (type-only imports: no server code reaches the browser).
export type { DisputeLabel, DisputeRow } from "@/db/queries/disputes";
export type DisputeList = { data: DisputeRow[]; total: number; pairs: Array<{ a: number; b: number; n: number }>; next: string | null };
export type Ruling = { id: number; disputeId: number; classId: number; className: string; reason: string; reviewerId: string; reviewerName: string | null; createdAt: string };
export type DisputeDetail = {
  dispute: DisputeRow;
  item: { id: number; externalId: string; fields: Record<string, unknown>; imageUrl: string | null; isControl: boolean; isBlind: boolean };
  flags: Array<{ kind: "skip" | "flag"; comment: string | null; name: string | null; createdAt: string }>;
  suggestion: { topClassId: number | null; shares: Record<string, number>; k: number; distance: string; neighbours: DeskNeighbour[]; votersCount: number } | null;
  ruling: Ruling | null;
};
