// Whole-project computations against the real database: pool re-ranking writes scores, Tuning and
// Doubts equal lib/knn's own tune/findDoubts on the same set, Doubts → Disputes, the pool trigger.
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { disputes, items, knnState } from "@/db/schema";
import { ExactIndex, computeMap, findDoubts, fitPreprocessor, transformTable, tune, vote, entropy, leastConfident, margin } from "@/lib/knn";
import { openDoubtDisputeByItemId } from "@/db/queries/suggest";
import { computeDoubts } from "@/lib/suggest/doubts";
import { computeProjectMap } from "@/lib/suggest/map";
import { loadProjectSet } from "@/lib/suggest/project-set";
import { runPoolRank } from "@/lib/suggest/pool-rank";
import { maybeEnqueuePoolRank } from "@/lib/suggest/pool-trigger";
import { computeTuning } from "@/lib/suggest/tuning";
import { markKnnChanged } from "@/lib/suggest/version";
import { buildWorld, type World } from "./world";

let w: World;
let x: Float32Array;
beforeAll(async () => {
  w = await buildWorld({ n: 150, seed: 11 });
  const table = { n: w.vectors.length, numeric: Float32Array.from(w.vectors.flat()), numericWidth: 4, categorical: [] };
  x = transformTable(fitPreprocessor(table, "zscore"), table);
});
afterAll(async () => {
  await pool.end();
});

/** The voters as a lib/knn LabelledSet built here from world.ts's expected votes. */
function voterSet() {
  const rows = w.expectedVote.map((c, r) => (c >= 0 ? r : -1)).filter((r) => r >= 0);
  const vectors = new Float32Array(rows.length * 4);
  rows.forEach((r, i) => vectors.set(x.subarray(r * 4, r * 4 + 4), i * 4));
  return { rows, set: { vectors, dim: 4, classes: Int32Array.from(rows, (r) => w.expectedVote[r]), ids: Int32Array.from(rows, (r) => w.ids[r]), numClasses: 3 } };
}

describe("pool re-ranking", () => {
  it("writes vote shares and the three ordering scores for every item still to be labelled", async () => {
    const summary = await runPoolRank(w.project.id);
    const { set } = voterSet();
    const open = w.ids.map((_, r) => r).filter((r) => r >= 79 || (r >= 60 && r < 70));
    expect(summary.poolItems).toBe(open.length);
    expect(summary.voters).toBe(set.classes.length);
    const rows = await db.select().from(items).where(eq(items.projectId, w.project.id));
    const byId = new Map(rows.map((r) => [r.id, r]));
    const exact = ExactIndex.from(set.vectors, 4, set.classes, "euclidean", set.ids);
    const [ks] = await db.select().from(knnState).where(eq(knnState.projectId, w.project.id));
    for (const r of open) {
      const v = vote(exact.search(x.subarray(r * 4, r * 4 + 4), 5, { excludeId: w.ids[r] }), 3, "uniform");
      const row = byId.get(w.ids[r])!;
      expect(row.poolShares!.map((s) => Number(s.toFixed(5)))).toEqual(Array.from(v.shares, (s) => Number(s.toFixed(5))));
      expect(row.poolTopClassId).toBe(w.classes[v.top].id);
      expect(row.poolTopShare!).toBeCloseTo(v.shares[v.top], 5);
      expect(row.scoreLeastConfident!).toBeCloseTo(leastConfident(v.shares), 5);
      expect(row.scoreMargin!).toBeCloseTo(margin(v.shares), 5);
      expect(row.scoreEntropy!).toBeCloseTo(entropy(v.shares), 5);
      expect(row.poolVersion).toBe(ks.version);
    }
    // Decided items are not in the pool.
    expect(byId.get(w.ids[0])!.poolVersion).toBeNull();
  });

  it("gives the same scores with two worker threads as in one thread", async () => {
    const read = async () => (await db.select({ id: items.id, s: items.poolShares, m: items.scoreMargin }).from(items).where(eq(items.projectId, w.project.id))).sort((a, b) => a.id - b.id);
    await runPoolRank(w.project.id, { threads: 0 });
    const one = await read();
    await db.update(items).set({ poolShares: null, scoreMargin: null }).where(eq(items.projectId, w.project.id));
    const summary = await runPoolRank(w.project.id, { threads: 2 });
    expect(summary.method).toBe("exact");
    expect(await read()).toEqual(one);
  }, 20_000);

  it("the trigger enqueues once the label count reaches poolRerankEvery, and claims the counter", async () => {
    for (let i = 0; i < 24; i += 1) await db.transaction((tx) => markKnnChanged(tx, w.project.id, [w.ids[i]]));
    expect(await maybeEnqueuePoolRank(w.project.id)).toBe(false);
    await db.transaction((tx) => markKnnChanged(tx, w.project.id, [w.ids[24]]));
    expect(await maybeEnqueuePoolRank(w.project.id)).toBe(true);
    expect(await maybeEnqueuePoolRank(w.project.id)).toBe(false);
    const [ks] = await db.select().from(knnState).where(eq(knnState.projectId, w.project.id));
    expect(ks.labelsSincePoolRank).toBe(0);
    const jobs = await db.execute<{ n: number }>(sql`select count(*)::int as n from pgboss.job where name = 'pool-rank' and data->>'projectId' = ${String(w.project.id)}`);
    expect(jobs.rows[0].n).toBe(1);
  });
});

describe("Tuning", () => {
  it("equals lib/knn's tune() over the same labelled set for every k and distance", async () => {
    const out = await computeTuning(w.project.id);
    const { set } = voterSet();
    const ref = tune(set, { distances: ["euclidean", "manhattan", "cosine"] });
    expect(out!.report.results).toHaveLength(26 * 3);
    expect(out!.report.sampled).toBe(false);
    for (const r of ref) {
      const got = out!.report.results.find((g) => g.k === r.k && g.distance === r.distance)!;
      expect(got.correct).toBe(r.correct);
      expect(got.n).toBe(r.n);
      expect(got.macroF1).toBeCloseTo(r.macroF1, 12);
      expect(got.logLoss).toBeCloseTo(r.logLoss, 12);
      expect(got.reliability.ece).toBeCloseTo(r.reliability.ece, 12);
    }
    expect(out!.report.smoothing).toMatch(/0\.001/);
  });
});

describe("worker job handlers", () => {
  it("tuning, doubts and map handlers fill their report rows; pool-rank runs for a project", async () => {
    const { createReport, getReportById } = await import("@/lib/suggest/reports");
    const handlers = [
      ["tuning", (await import("@/worker/jobs/tuning")).handleTuning],
      ["doubts", (await import("@/worker/jobs/doubts")).handleDoubts],
      ["map", (await import("@/worker/jobs/map")).handleMap],
    ] as const;
    for (const [kind, handle] of handlers) {
      const r = await createReport({ projectId: w.project.id, kind, params: {}, knnVersion: 0, createdBy: null });
      await handle({ reportId: r.id });
      const done = (await getReportById(r.id))!;
      expect(done.status).toBe("succeeded");
      expect(done.progress).toBe(1);
      expect(done.knnVersion).toBeGreaterThan(0);
      expect(done.result).toBeTruthy();
    }
    const { handlePoolRank } = await import("@/worker/jobs/pool-rank");
    await expect(handlePoolRank({ projectId: w.project.id })).resolves.toBeUndefined();
  });
});

describe("Doubts", () => {
  it("lists labelled items by their own label's share among their neighbours, as lib/knn's findDoubts orders them", async () => {
    const out = await computeDoubts(w.project.id);
    const { set } = voterSet();
    const ref = findDoubts(set, { k: 5 }).filter((d) => d.ownShare < 0.5);
    expect(out!.report.doubts.map((d) => d.itemId)).toEqual(ref.map((d) => d.id));
    expect(out!.report.doubts.map((d) => d.ownShare)).toEqual(ref.map((d) => d.ownShare));
    for (const d of out!.report.doubts) {
      expect(d.neighbours).toHaveLength(5);
      expect(d.neighbours.map((n) => n.itemId)).not.toContain(d.itemId);
    }
    // Most planted wrong labels (every seventh agreed item, 9 in all) are listed (own share below 0.5).
    const planted = new Set(w.ids.filter((_, i) => i < 60 && i % 7 === 3));
    const found = out!.report.doubts.filter((d) => planted.has(d.itemId));
    expect(found.length).toBeGreaterThanOrEqual(7);
  });

  it("sends a doubted item to Disputes once; a second time is a clear conflict", async () => {
    const out = await computeDoubts(w.project.id);
    const itemId = out!.report.doubts[0].itemId;
    const d = await openDoubtDisputeByItemId({ projectId: w.project.id, itemId, userId: w.users.owner.id });
    expect(d.reason).toBe("doubt");
    expect(d.status).toBe("open");
    const [item] = await db.select().from(items).where(eq(items.id, itemId));
    expect(item.status).toBe("disputed");
    await expect(openDoubtDisputeByItemId({ projectId: w.project.id, itemId, userId: w.users.owner.id })).rejects.toMatchObject({ code: "conflict:dispute_open", status: 409 });
    const open = await db.select().from(disputes).where(and(eq(disputes.itemId, itemId), eq(disputes.status, "open")));
    expect(open).toHaveLength(1);
    await expect(openDoubtDisputeByItemId({ projectId: w.project.id + 100000, itemId, userId: w.users.owner.id })).rejects.toMatchObject({ code: "not_found:item" });
  });
});

describe("Map", () => {
  it("projects every item, colours points by final label and draws regions for each k of the slider", async () => {
    const out = await computeProjectMap(w.project.id);
    const m = out!.report;
    expect(m.items).toBe(150);
    expect(m.points).toHaveLength(150);
    expect(m.ks).toContain(5);
    expect(m.regions["5"].classIndex).toHaveLength(m.grid.size * m.grid.size);
    expect(m.method).toMatch(/projected plane/);
    expect(m.sampling).toMatch(/of 150 rows/);
    const unlabelled = m.points.find((p) => p[0] === w.ids[120])!;
    expect(unlabelled[3]).toBe(-1);
    const agreed = m.points.find((p) => p[0] === w.ids[0])!;
    expect(agreed[3]).toBe(w.expectedVote[0]);
    // k = 1 regions are rougher than k = 51: more cells whose class differs from a neighbouring cell.
    const edges = (k: number) => {
      const c = m.regions[String(k)].classIndex;
      let e = 0;
      for (let y = 0; y < m.grid.size; y += 1) for (let xx = 1; xx < m.grid.size; xx += 1) if (c[y * m.grid.size + xx] !== c[y * m.grid.size + xx - 1]) e += 1;
      return e;
    };
    expect(edges(1)).toBeGreaterThan(edges(51));
  });

  it("regions for the slider's other ks equal lib/knn's computeMap run at that k", async () => {
    const out = await computeProjectMap(w.project.id);
    const ps = (await loadProjectSet(w.project.id, { includeNonVoters: true }))!;
    for (const k of [1, 11, 51]) {
      const ref = computeMap(ps.set, { k, weighting: "uniform", seed: 1 });
      expect(out!.report.regions[String(k)].classIndex).toEqual(ref.grid.cells.map((c) => c.classIndex));
      expect(out!.report.regions[String(k)].topShare).toEqual(ref.grid.cells.map((c) => Math.round(c.topShare * 100)));
    }
  });
});
