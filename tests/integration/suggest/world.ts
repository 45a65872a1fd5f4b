// A small project built row by row in the real database (invented data for the tests), with the
// class every item should vote with worked out here, independently of the SQL under test.
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { disputes, items, labels, projects, rulings } from "@/db/schema";
import type { FeatureSchema, ProjectSettings } from "@/lib/projects/settings";
import { mulberry32, normal, packFloat32 } from "@/lib/random";
import { makeProject, makeUser } from "@/tests/support/fixtures";

export const featureSchema: FeatureSchema = {
  source: "table",
  dimension: 4,
  columns: [
    { name: "a", kind: "numeric", width: 1 },
    { name: "b", kind: "numeric", width: 1 },
    { name: "c", kind: "numeric", width: 1 },
    { name: "d", kind: "numeric", width: 1 },
  ],
};

// Class centres on deliberately different scales (column b in the hundreds) so z-scoring matters.
const centres = [
  [0, 100, 1, 5],
  [2, 300, 2, 5],
  [1, 200, 3, 9],
];
const spreads = [0.8, 60, 0.7, 1.5];

export type World = Awaited<ReturnType<typeof buildWorld>>;

export async function buildWorld(opts: { n?: number; settings?: Partial<ProjectSettings>; seed?: number; agreedTail?: number } = {}) {
  const n = opts.n ?? 120;
  const rand = mulberry32(opts.seed ?? 7);
  const owner = await makeUser();
  const reviewer = await makeUser();
  const annA = await makeUser();
  const annB = await makeUser();
  const viewer = await makeUser();
  const { project, classes } = await makeProject({
    settings: { k: 5, ...opts.settings },
    members: [
      { userId: owner.id, role: "owner" },
      { userId: reviewer.id, role: "reviewer" },
      { userId: annA.id, role: "annotator" },
      { userId: annB.id, role: "annotator" },
      { userId: viewer.id, role: "viewer" },
    ],
  });
  await db.update(projects).set({ featureSchema }).where(eq(projects.id, project.id));
  const truth: number[] = [];
  const vectors: number[][] = [];
  const rows = [];
  for (let i = 0; i < n; i += 1) {
    const g = i % 3;
    truth.push(g);
    const v = centres[g].map((c, j) => Number((c + normal(rand) * spreads[j]).toFixed(3)));
    vectors.push(v);
    rows.push({
      projectId: project.id,
      externalId: `IT-${String(i).padStart(4, "0")}`,
      fields: { a: v[0], b: v[1], c: v[2], d: v[3], note: `item ${i}` },
      vector: packFloat32(v),
      isBlind: i % 10 === 9,
      isControl: i === 78,
      knownClassId: i === 78 ? classes[g].id : null,
      status: i === 78 ? ("control" as const) : ("unlabelled" as const),
    });
  }
  const inserted = await db.insert(items).values(rows).returning({ id: items.id });
  const ids = inserted.map((r) => r.id);
  /** The class index each item votes with under the default voters (ruling > agreed > single > control), −1 = none. */
  const expectedVote = new Array<number>(n).fill(-1);
  const label = (i: number, annotatorId: string, c: number) => ({ projectId: project.id, itemId: ids[i], annotatorId, classId: classes[c].id, clientSubmissionId: randomUUID() });
  const labelRows = [];
  for (let i = 0; i < 60; i += 1) {
    // Every seventh agreed item carries a wrong label: these are the Doubts to find.
    const c = i % 7 === 3 ? (truth[i] + 1) % 3 : truth[i];
    labelRows.push(label(i, annA.id, c), label(i, annB.id, c));
    await db.update(items).set({ status: "agreed", labelCount: 2, finalClassId: classes[c].id, finalSource: "agreed", decidedAt: new Date() }).where(eq(items.id, ids[i]));
    expectedVote[i] = c;
  }
  for (let i = 60; i < 70; i += 1) {
    labelRows.push(label(i, annA.id, truth[i]));
    await db.update(items).set({ status: "in_progress", labelCount: 1 }).where(eq(items.id, ids[i]));
    expectedVote[i] = truth[i];
  }
  for (let i = 70; i < 78; i += 1) {
    labelRows.push(label(i, annA.id, truth[i]), label(i, annB.id, (truth[i] + 1) % 3));
    await db.update(items).set({ status: "disputed", labelCount: 2 }).where(eq(items.id, ids[i]));
    const [d] = await db.insert(disputes).values({ projectId: project.id, itemId: ids[i], reason: "disagreement" }).returning();
    if (i >= 75) {
      const ruled = (truth[i] + 2) % 3;
      await db.insert(rulings).values({ disputeId: d.id, reviewerId: reviewer.id, classId: classes[ruled].id, reason: "test ruling" });
      await db.update(disputes).set({ status: "ruled", closedAt: new Date() }).where(eq(disputes.id, d.id));
      await db.update(items).set({ status: "ruled", finalClassId: classes[ruled].id, finalSource: "ruling", decidedAt: new Date() }).where(eq(items.id, ids[i]));
      expectedVote[i] = ruled;
    }
  }
  expectedVote[78] = truth[78];
  // Optionally many more agreed items after the control item (for pages that need a few hundred labels).
  for (let i = 79; i < Math.min(n, 79 + (opts.agreedTail ?? 0)); i += 1) {
    const c = i % 11 === 5 ? (truth[i] + 1) % 3 : truth[i];
    labelRows.push(label(i, annA.id, c), label(i, annB.id, c));
    await db.update(items).set({ status: "agreed", labelCount: 2, finalClassId: classes[c].id, finalSource: "agreed", decidedAt: new Date() }).where(eq(items.id, ids[i]));
    expectedVote[i] = c;
  }
  await db.insert(labels).values(labelRows);
  return { project, classes, ids, truth, vectors, expectedVote, users: { owner, reviewer, annA, annB, viewer } };
}

/** Adds one live label by `annotatorId` and marks the item in progress (what the Desk does, minus the suggestion snapshot). */
export async function addLabel(w: World, i: number, annotatorId: string, c: number, bump: boolean) {
  const { markKnnChanged } = await import("@/lib/suggest/version");
  await db.transaction(async (tx) => {
    await tx.insert(labels).values({ projectId: w.project.id, itemId: w.ids[i], annotatorId, classId: w.classes[c].id, clientSubmissionId: randomUUID() });
    await tx.update(items).set({ status: "in_progress", labelCount: sql`${items.labelCount} + 1` }).where(eq(items.id, w.ids[i]));
    if (bump) await markKnnChanged(tx, w.project.id, [w.ids[i]]);
  });
}
