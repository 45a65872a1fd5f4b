/** What an item's live labels decide once it has `overlap` of them (pure; control items never come here). */
export type Consensus =
  | { kind: "pending" }
  | { kind: "final"; classId: number; source: "agreed" | "single" }
  | { kind: "disputed"; classIds: number[] };

export function decideConsensus(classIds: number[], overlap: number): Consensus {
  if (classIds.length < overlap || classIds.length === 0) return { kind: "pending" };
  const distinct = [...new Set(classIds)].sort((a, b) => a - b);
  if (distinct.length === 1) return { kind: "final", classId: distinct[0], source: overlap === 1 ? "single" : "agreed" };
  return { kind: "disputed", classIds: distinct };
}
