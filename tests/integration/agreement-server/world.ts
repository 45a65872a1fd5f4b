// Labels written straight to the database for the agreement tests (real PostgreSQL, no mocks).
import { sql } from "drizzle-orm";
import { db } from "@/db";
import { items } from "@/db/schema";
import { createRandom } from "@/lib/agreement";
import { insertLabels as insertSharedLabels, type LabelSpec as SharedLabelSpec } from "../../support/labels";

/** No `createdAt`: labels are stamped now by the database, and an undone one is undone now. */
export type LabelSpec = Omit<SharedLabelSpec, "createdAt">;

export type ItemSpec = { externalId: string; isBlind?: boolean; isControl?: boolean; knownClassId?: number | null; finalClassId?: number | null };

export async function insertItems(projectId: number, specs: ItemSpec[]) {
  const rows = await db
    .insert(items)
    .values(specs.map((s) => ({ projectId, externalId: s.externalId, isBlind: s.isBlind ?? false, isControl: s.isControl ?? false, knownClassId: s.knownClassId ?? null, finalClassId: s.finalClassId ?? null })))
    .returning({ id: items.id });
  return rows.map((r) => r.id);
}

export const insertLabels: (projectId: number, specs: LabelSpec[]) => Promise<void> = insertSharedLabels;

export async function bumpVersion(projectId: number) {
  await db.execute(sql`update knn_state set version = version + 1 where project_id = ${projectId}`);
}

/**
 * A seeded project's worth of labels: each item gets 2–4 of the annotators, who mostly agree with a
 * hidden truth; a share of items is blind (suggestion stored, not shown), some are control items,
 * most have a final label; one label per annotator is undone (must be ignored).
 */
export function seededLabels(opts: { seed: number; itemIds: number[]; blind: boolean[]; annotators: string[]; classIds: number[]; truth: number[] }): LabelSpec[] {
  const random = createRandom(opts.seed);
  const out: LabelSpec[] = [];
  const undoneDone = new Set<string>();
  opts.itemIds.forEach((item, i) => {
    const raters = opts.annotators.filter(() => random() < 0.7);
    const truth = opts.classIds[opts.truth[i]];
    const top = random() < 0.8 ? truth : opts.classIds[Math.floor(random() * opts.classIds.length)];
    for (const annotator of raters) {
      const blind = opts.blind[i];
      const noSuggestion = !blind && random() < 0.1;
      const shown = !blind && !noSuggestion;
      const took = shown && random() < 0.6;
      const classId = took ? top : random() < 0.75 ? truth : opts.classIds[Math.floor(random() * opts.classIds.length)];
      if (!undoneDone.has(annotator) && random() < 0.2) {
        undoneDone.add(annotator);
        const other = opts.classIds[(opts.classIds.indexOf(classId) + 1) % opts.classIds.length];
        out.push({ item, annotator, classId: other, suggestion: "shown", topClassId: top, took: false, undone: true });
      }
      out.push({ item, annotator, classId, suggestion: blind ? "hidden" : noSuggestion ? "none" : "shown", topClassId: noSuggestion ? null : top, took });
    }
  });
  return out;
}
