// Labels written straight to the database for integration tests (real PostgreSQL, no mocks).
import { randomUUID } from "node:crypto";
import { db } from "@/db";
import { labels, type SuggestionSnapshot } from "@/db/schema";

export type LabelSpec = {
  item: number;
  annotator: string;
  classId: number;
  /** "shown": suggestion on screen; "hidden": stored but not shown (blind item); "none": no suggestion at all. */
  suggestion: "shown" | "hidden" | "none";
  topClassId: number | null;
  took: boolean;
  undone?: boolean;
  /** Absent: the database's default (now). */
  createdAt?: Date;
};

export const suggestionSnapshot = (spec: LabelSpec): SuggestionSnapshot | null =>
  spec.suggestion === "none" ? null : { shown: spec.suggestion === "shown", topClassId: spec.topClassId, shares: {}, k: 5, distance: "euclidean", engineVersion: "test", knnVersion: 1 };

/** An undone label is undone 1 s after its `createdAt`, or now when it has none. */
export async function insertLabels(projectId: number, specs: LabelSpec[]) {
  if (!specs.length) return;
  await db.insert(labels).values(
    specs.map((s) => ({
      projectId,
      itemId: s.item,
      annotatorId: s.annotator,
      classId: s.classId,
      suggestion: suggestionSnapshot(s),
      tookSuggestion: s.took,
      clientSubmissionId: randomUUID(),
      ...(s.createdAt ? { createdAt: s.createdAt } : {}),
      undoneAt: s.undone ? (s.createdAt ? new Date(s.createdAt.getTime() + 1000) : new Date()) : null,
    })),
  );
}
