// The suggestion service against the real database: shares equal a direct lib/knn computation,
// incremental updates equal a rebuild, the version check across processes, no self-votes.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { items, knnState, labelClasses, projects } from "@/db/schema";
import { ExactIndex, fitPreprocessor, suggest, transformTable } from "@/lib/knn";
import { packFloat32 } from "@/lib/random";
import { clearEngineCache, peekEngine } from "@/lib/suggest/cache";
import { computeSuggestion } from "@/lib/suggest/suggestion";
import { markKnnChanged } from "@/lib/suggest/version";
import { makeProject } from "@/tests/support/fixtures";
import { addLabel, buildWorld, type World } from "./world";

/** Reference: z-score fitted on every item, voters as worked out in world.ts, lib/knn's exact suggest. */
function reference(w: World, vectors: number[][], expectedVote: number[], i: number, k: number) {
  const n = vectors.length;
  const table = { n, numeric: Float32Array.from(vectors.flat()), numericWidth: 4, categorical: [] };
  const state = fitPreprocessor(table, "zscore");
  const x = transformTable(state, table);
  const voters = expectedVote.map((c, r) => (c >= 0 ? r : -1)).filter((r) => r >= 0);
  const index = new ExactIndex(4, "euclidean");
  for (const r of voters) index.upsert(w.ids[r], x.subarray(r * 4, r * 4 + 4), expectedVote[r]);
  return suggest(index, x.subarray(i * 4, i * 4 + 4), { k, numClasses: 3, excludeId: w.ids[i] });
}

let w: World;
beforeAll(async () => {
  w = await buildWorld();
});
afterAll(async () => {
  await pool.end();
});

describe("getSuggestion", () => {
  it("equals a direct lib/knn computation on the same data, for voters and non-voters", async () => {
    for (const i of [0, 3, 61, 75, 78, 80, 95, 119]) {
      const s = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[i] });
      const ref = reference(w, w.vectors, w.expectedVote, i, 5);
      expect(s.neighbours.map((n) => n.itemId)).toEqual(ref.neighbours.map((n) => n.id));
      w.classes.forEach((c, ci) => expect(s.shares[String(c.id)]).toBeCloseTo(ref.shares[ci], 12));
      expect(s.topClassId).toBe(w.classes[ref.top].id);
      expect(s.neighbours.map((n) => n.classId)).toEqual(ref.neighbours.map((n) => w.classes[n.classIndex].id));
      s.neighbours.forEach((n, j) => expect(n.distance).toBeCloseTo(ref.neighbours[j].distance, 5));
      expect(Object.values(s.shares).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
    }
    const count = w.expectedVote.filter((c) => c >= 0).length;
    const s = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[100] });
    expect(s.votersCount).toBe(count);
    expect(s.k).toBe(5);
    expect(s.engineVersion).toBe("vicinal-knn/1");
  });

  it("an item never votes for itself (a voter's own id is never among its neighbours)", async () => {
    for (const i of [0, 1, 2, 60, 76, 78]) {
      const s = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[i] });
      expect(s.neighbours).toHaveLength(5);
      expect(s.neighbours.map((n) => n.itemId)).not.toContain(w.ids[i]);
    }
  });

  it("answers 404 for an item of another project", async () => {
    const other = await makeProject();
    await expect(computeSuggestion({ projectId: other.project.id, itemId: w.ids[0] })).rejects.toMatchObject({ code: "not_found:item" });
  });

  it("an incremental update after new labels equals a rebuild", async () => {
    await computeSuggestion({ projectId: w.project.id, itemId: w.ids[90] });
    const before = peekEngine(w.project.id)!;
    const rebuilds = before.stats.rebuilds;
    const incremental = before.stats.incremental;
    // item 90 gets a single label (it starts voting); item 60 gets a second, disagreeing one (it stops voting).
    await addLabel(w, 90, w.users.annA.id, 2, true);
    await addLabel(w, 60, w.users.annB.id, (w.truth[60] + 1) % 3, true);
    const probe = [91, 92, 85, 59, 61];
    const inc = await Promise.all(probe.map((i) => computeSuggestion({ projectId: w.project.id, itemId: w.ids[i] })));
    const after = peekEngine(w.project.id)!;
    expect(after.stats.rebuilds).toBe(rebuilds);
    expect(after.stats.incremental).toBeGreaterThan(incremental);
    expect(after.index!.has(w.ids[90])).toBe(true);
    expect(after.index!.has(w.ids[60])).toBe(false);
    clearEngineCache(w.project.id);
    const fresh = await Promise.all(probe.map((i) => computeSuggestion({ projectId: w.project.id, itemId: w.ids[i] })));
    expect(peekEngine(w.project.id)!.stats.rebuilds).toBe(1);
    expect(inc.map(({ neighbours, shares, topClassId, votersCount }) => ({ neighbours, shares, topClassId, votersCount }))).toEqual(
      fresh.map(({ neighbours, shares, topClassId, votersCount }) => ({ neighbours, shares, topClassId, votersCount })),
    );
    // And both equal the reference with the new votes.
    const votes = [...w.expectedVote];
    votes[90] = 2;
    votes[60] = -1;
    const ref = reference(w, w.vectors, votes, 91, 5);
    expect(fresh[0].neighbours.map((n) => n.itemId)).toEqual(ref.neighbours.map((n) => n.id));
  });

  it("checks knn_state.version before answering: a write another process made is seen once the version moves", async () => {
    // Find q and u among the unlabelled items (rows 79+, 90 now votes) such that u is q's nearest item of all (a plain scan of the reference rows).
    const table = { n: w.vectors.length, numeric: Float32Array.from(w.vectors.flat()), numericWidth: 4, categorical: [] };
    const x = transformTable(fitPreprocessor(table, "zscore"), table);
    const d2 = (a: number, b: number) => [0, 1, 2, 3].reduce((s, j) => s + (x[a * 4 + j] - x[b * 4 + j]) ** 2, 0);
    const open = (r: number) => r >= 79 && r !== 90;
    const nearest = (q: number) => w.ids.map((_, r) => r).filter((r) => r !== q).reduce((best, r) => (d2(q, r) < d2(q, best) ? r : best));
    const q = w.ids.map((_, r) => r).find((r) => open(r) && open(nearest(r)))!;
    expect(q).toBeDefined();
    const u = nearest(q);
    const first = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[q] });
    expect(first.neighbours.map((n) => n.itemId)).not.toContain(w.ids[u]);
    // "Another process" gives u its first label without bumping the version: this process cannot know yet.
    await addLabel(w, u, w.users.annA.id, 0, false);
    const stale = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[q] });
    expect(stale.neighbours.map((n) => n.itemId)).not.toContain(w.ids[u]);
    expect(stale.knnVersion).toBe(first.knnVersion);
    // Bumping the version (as the writer's transaction does) makes this process catch up: u is now q's nearest voter.
    await db.transaction((tx) => markKnnChanged(tx, w.project.id, [w.ids[u]]));
    const caught = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[q] });
    expect(caught.knnVersion).toBe(first.knnVersion + 1);
    expect(caught.neighbours[0].itemId).toBe(w.ids[u]);
    expect(caught.neighbours[0].classId).toBe(w.classes[0].id);
    // A second process (empty cache) computes the same answer.
    clearEngineCache(w.project.id);
    const second = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[q] });
    expect(second.neighbours).toEqual(caught.neighbours);
    expect(second.shares).toEqual(caught.shares);
  });

  it("rebuilds when the engine settings change (settings hash), with the new k and distance", async () => {
    const [p] = await db.select().from(projects).where(eq(projects.id, w.project.id));
    await db.update(projects).set({ settings: { ...p.settings, k: 3, distance: "manhattan" } }).where(eq(projects.id, w.project.id));
    await db.update(knnState).set({ version: 1000 }).where(eq(knnState.projectId, w.project.id));
    const rebuilds = peekEngine(w.project.id)!.stats.rebuilds;
    const s = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[100] });
    expect(s.k).toBe(3);
    expect(s.distance).toBe("manhattan");
    expect(s.neighbours).toHaveLength(3);
    expect(peekEngine(w.project.id)!.stats.rebuilds).toBe(rebuilds + 1);
    const [ks] = await db.select().from(knnState).where(eq(knnState.projectId, w.project.id));
    expect(ks.settingsHash).toMatch(/^[0-9a-f]{16}$/);
    await db.update(projects).set({ settings: p.settings }).where(eq(projects.id, w.project.id));
  });
});

describe("a hand-computable case", () => {
  // One feature; labelled x = 0 (A), 1 (A), 2 (B), 4 (B), 7 (B), 20 (A); the query x = 3 is unlabelled.
  // Nearest three to 3: x = 2 and x = 4 (distance 1 each, both B), then x = 1 (distance 2, A).
  // Uniform k = 3: B 2/3, A 1/3. Inverse (1/d): B 1 + 1 = 2, A 1/2 → B 0.8, A 0.2 (z-scoring divides
  // every distance by the same standard deviation, which cancels in the shares).
  async function tiny(weighting: "uniform" | "inverse") {
    const { project, classes } = await makeProject({ classes: ["A", "B"], settings: { k: 3, weighting } });
    await db.update(projects).set({ featureSchema: { source: "table", dimension: 1, columns: [{ name: "x", kind: "numeric", width: 1 }] } }).where(eq(projects.id, project.id));
    const xs = [0, 1, 2, 4, 7, 20, 3];
    const cls = [0, 0, 1, 1, 1, 0, -1];
    const rows = await db
      .insert(items)
      .values(xs.map((x, i) => ({ projectId: project.id, externalId: `x${x}`, fields: { x }, vector: packFloat32([x]), status: cls[i] >= 0 ? ("control" as const) : ("unlabelled" as const), isControl: cls[i] >= 0, knownClassId: cls[i] >= 0 ? classes[cls[i]].id : null })))
      .returning({ id: items.id });
    return { project, classes, rows };
  }

  it("uniform votes: shares 1/3 and 2/3, distances divided by the population standard deviation", async () => {
    const { project, classes, rows } = await tiny("uniform");
    const s = await computeSuggestion({ projectId: project.id, itemId: rows[6].id });
    expect(s.shares[String(classes[0].id)]).toBeCloseTo(1 / 3, 12);
    expect(s.shares[String(classes[1].id)]).toBeCloseTo(2 / 3, 12);
    expect(s.topClassId).toBe(classes[1].id);
    // Population sd of {0, 1, 2, 3, 4, 7, 20}: mean 37/7; Σ(x − mean)² = 1984/7; sd = √(1984/49).
    const sd = Math.sqrt(1984 / 49);
    expect(s.neighbours.map((n) => n.distance)).toEqual([expect.closeTo(1 / sd, 5), expect.closeTo(1 / sd, 5), expect.closeTo(2 / sd, 5)]);
    // Equal distances: the lower item id first (x = 2 was inserted before x = 4).
    expect(s.neighbours.map((n) => n.externalId)).toEqual(["x2", "x4", "x1"]);
  });

  it("inverse-distance votes: shares 0.2 and 0.8", async () => {
    const { project, classes, rows } = await tiny("inverse");
    const s = await computeSuggestion({ projectId: project.id, itemId: rows[6].id });
    expect(s.shares[String(classes[0].id)]).toBeCloseTo(0.2, 6);
    expect(s.shares[String(classes[1].id)]).toBeCloseTo(0.8, 6);
    const [lc] = await db.select().from(labelClasses).where(eq(labelClasses.id, classes[1].id));
    expect(lc.name).toBe("B");
  });

  it("categorical columns from fields are one-hot encoded like lib/knn's preprocessing (mixed table)", async () => {
    const { project, classes } = await makeProject({ classes: ["A", "B"], settings: { k: 3 } });
    const schema = { source: "table" as const, dimension: 1, columns: [{ name: "x", kind: "numeric" as const, width: 1 }, { name: "kind", kind: "categorical" as const, width: 0 }] };
    await db.update(projects).set({ featureSchema: schema }).where(eq(projects.id, project.id));
    const xs = [0, 0.2, 0.4, 0.5, 0.6, 0.9, 0.45];
    const kinds = ["red", "blue", "red", "blue", "red", null, "blue"];
    const cls = [0, 1, 0, 1, 0, 1, -1];
    const rows = await db
      .insert(items)
      .values(xs.map((x, i) => ({ projectId: project.id, externalId: `m${i}`, fields: { x, kind: kinds[i], note: "long text ".repeat(20) }, vector: packFloat32([x]), status: cls[i] >= 0 ? ("control" as const) : ("unlabelled" as const), isControl: cls[i] >= 0, knownClassId: cls[i] >= 0 ? classes[cls[i]].id : null })))
      .returning({ id: items.id });
    const table = { n: 7, numeric: Float32Array.from(xs), numericWidth: 1, categorical: [kinds] };
    const state = fitPreprocessor(table, "zscore");
    expect(state.width).toBe(3);
    const enc = transformTable(state, table);
    const index = new ExactIndex(3, "euclidean");
    for (let i = 0; i < 6; i += 1) index.upsert(rows[i].id, enc.subarray(i * 3, i * 3 + 3), cls[i]);
    const ref = suggest(index, enc.subarray(18, 21), { k: 3, numClasses: 2 });
    const s = await computeSuggestion({ projectId: project.id, itemId: rows[6].id });
    expect(s.neighbours.map((n) => n.itemId)).toEqual(ref.neighbours.map((n) => n.id));
    expect(s.shares[String(classes[1].id)]).toBeCloseTo(ref.shares[1], 12);
    // The blue neighbour at x = 0.5 is nearer than the red one at x = 0.4 once the colour counts.
    expect(s.neighbours[0].externalId).toBe("m3");
  });
});
