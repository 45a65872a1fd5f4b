// A project with decided, disputed, control and unlabelled items written straight to the database (no mocks).
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { items, labels, projects } from "@/db/schema";
import { publishEdition } from "@/lib/editions/run";
import type { FeatureSchema } from "@/lib/projects/settings";
import { packFloat32 } from "@/lib/random";
import { makeRoleWorld, makeUser } from "../../support/fixtures";

export const featureSchema: FeatureSchema = {
  source: "table",
  dimension: 2,
  columns: [
    { name: "x", kind: "numeric", width: 1 },
    { name: "y", kind: "numeric", width: 1 },
    { name: "colour", kind: "categorical", width: 0 },
  ],
};

export type Expected = { externalId: string; label: string | null; source: string; blind: boolean; control: boolean };

/** Item i's external id; item 3 starts with "=" and item 4 with "-" to exercise formula neutralising end to end. */
export const extId = (i: number) => (i === 3 ? "=1+1" : i === 4 ? "-item-04" : `item-${String(i).padStart(2, "0")}`);

/**
 * 30 items over classes alpha, beta, gamma: 0–14 agreed by two annotators, 15–17 single, 18–19 ruled after a
 * disagreement, 20–22 disputed, 23–24 control items, 25–29 unlabelled. Every fifth item is blind.
 */
export async function makeEditionWorld() {
  const world = await makeRoleWorld();
  const rater = await makeUser({ name: "Second Rater" });
  await db.update(projects).set({ featureSchema }).where(eq(projects.id, world.project.id));
  const cls = world.classes;
  const ann = world.users.annotator.id;
  const expected: Expected[] = [];
  const snap = (top: number, shown: boolean) => ({
    shown,
    topClassId: cls[top].id,
    shares: Object.fromEntries(cls.map((c, j) => [String(c.id), j === top ? 0.6 : 0.2])),
    k: 5,
    distance: "euclidean",
    engineVersion: "test",
    knnVersion: 1,
  });
  for (let i = 0; i < 30; i += 1) {
    const c = i % 3;
    const blind = i % 5 === 0;
    const kind = i < 15 ? "agreed" : i < 18 ? "single" : i < 20 ? "ruling" : i < 23 ? "disputed" : i < 25 ? "control" : "unlabelled";
    const decided = kind === "agreed" || kind === "single" || kind === "ruling";
    const [item] = await db
      .insert(items)
      .values({
        projectId: world.project.id,
        externalId: extId(i),
        fields: { colour: ["red", "green", "=blue"][c] },
        vector: packFloat32([i * 0.5, -i]),
        isBlind: blind,
        isControl: kind === "control",
        knownClassId: kind === "control" ? cls[c].id : null,
        status: kind === "single" || kind === "agreed" ? "agreed" : kind === "ruling" ? "ruled" : kind === "control" ? "control" : kind === "disputed" ? "disputed" : "unlabelled",
        finalClassId: decided ? cls[c].id : null,
        finalSource: decided ? (kind as "agreed" | "single" | "ruling") : null,
        decidedAt: decided ? new Date() : null,
      })
      .returning();
    const label = (annotatorId: string, classIndex: number, undone = false) => ({
      projectId: world.project.id,
      itemId: item.id,
      annotatorId,
      classId: cls[classIndex].id,
      suggestion: snap(c, !blind),
      tookSuggestion: !blind && classIndex === c,
      clientSubmissionId: randomUUID(),
      undoneAt: undone ? new Date() : null,
    });
    if (kind === "agreed") await db.insert(labels).values([label(ann, c), label(rater.id, c), label(rater.id, (c + 1) % 3, true)]);
    if (kind === "single") await db.insert(labels).values([label(ann, c)]);
    if (kind === "ruling" || kind === "disputed") await db.insert(labels).values([label(ann, c), label(rater.id, (c + 1) % 3)]);
    if (kind === "control") await db.insert(labels).values([label(ann, c)]);
    if (kind !== "unlabelled") {
      expected.push({ externalId: extId(i), label: kind === "disputed" ? null : cls[c].name, source: kind, blind, control: kind === "control" });
    }
  }
  await db.execute(sql`update knn_state set version = version + 1 where project_id = ${world.project.id}`);
  return { ...world, rater, expected };
}

/** Runs the job in this process (waiting instead if a worker holds the edition). */
export async function runEditionJob(editionId: number) {
  const result = await publishEdition(editionId);
  if (result.status === "skipped" && result.reason === "another worker is building it") {
    for (let i = 0; i < 100; i += 1) {
      await new Promise((r) => setTimeout(r, 200));
      const again = await publishEdition(editionId);
      if (again.status !== "skipped" || again.reason !== "another worker is building it") return again;
    }
  }
  return result;
}
