// The change log behind knn_state.version (drizzle/0005): versions are given at commit, one per logged item, in commit
// order; a process reads exactly the items above its version; a gap in the log makes it rebuild; old rows are pruned.
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { knnChanges, knnState } from "@/db/schema";
import { clearEngineCache, peekEngine } from "@/lib/suggest/cache";
import { computeSuggestion } from "@/lib/suggest/suggestion";
import { CHANGE_LOG_KEEP, markKnnChanged } from "@/lib/suggest/version";
import { addLabel, buildWorld, type World } from "./world";

let w: World;
beforeAll(async () => {
  w = await buildWorld({ seed: 77 });
});
afterAll(async () => {
  await pool.end();
});

async function version(projectId = w.project.id) {
  const [ks] = await db.select({ version: knnState.version }).from(knnState).where(eq(knnState.projectId, projectId));
  return ks?.version ?? 0;
}

describe("knn change log", () => {
  it("gives the version at commit: inside the transaction nothing moves, a rollback logs nothing", async () => {
    const before = await version();
    await db.transaction(async (tx) => {
      await markKnnChanged(tx, w.project.id, [w.ids[3]]);
      const [inside] = await tx.select({ version: knnState.version }).from(knnState).where(eq(knnState.projectId, w.project.id));
      expect(inside.version).toBe(before);
    });
    expect(await version()).toBe(before + 1);
    const [row] = await db.select().from(knnChanges).where(and(eq(knnChanges.projectId, w.project.id), eq(knnChanges.version, before + 1)));
    expect(row.itemId).toBe(w.ids[3]);

    await db
      .transaction(async (tx) => {
        await markKnnChanged(tx, w.project.id, [w.ids[4]]);
        throw new Error("roll back");
      })
      .catch(() => undefined);
    expect(await version()).toBe(before + 1);
    const [{ n }] = await db.select({ n: sql<number>`count(*)::int` }).from(knnChanges).where(and(eq(knnChanges.projectId, w.project.id), eq(knnChanges.itemId, w.ids[4])));
    expect(n).toBe(0);
  });

  it("concurrent writers get distinct, gap-free versions, one per logged item", async () => {
    const before = await version();
    const ids = w.ids.slice(10, 30);
    await Promise.all(ids.map((id) => db.transaction((tx) => markKnnChanged(tx, w.project.id, [id]))));
    expect(await version()).toBe(before + ids.length);
    const rows = await db.select().from(knnChanges).where(and(eq(knnChanges.projectId, w.project.id), sql`${knnChanges.version} > ${before}`));
    expect(rows.map((r) => r.version).sort((a, b) => a! - b!)).toEqual(ids.map((_, i) => before + i + 1));
    expect(new Set(rows.map((r) => r.itemId))).toEqual(new Set(ids));
  });

  it("an incremental pass reads exactly the logged items", async () => {
    await computeSuggestion({ projectId: w.project.id, itemId: w.ids[90] });
    const before = { ...peekEngine(w.project.id)!.stats };
    await addLabel(w, 91, w.users.annA.id, 1, true);
    await computeSuggestion({ projectId: w.project.id, itemId: w.ids[92] });
    const after = peekEngine(w.project.id)!.stats;
    expect(after.rebuilds).toBe(before.rebuilds);
    expect(after.incremental).toBe(before.incremental + 1);
    expect(after.changedRows).toBe(before.changedRows + 1);
    expect(peekEngine(w.project.id)!.index!.has(w.ids[91])).toBe(true);
  });

  it("a version the log cannot account for (a gap) makes the process rebuild, and the answer equals a fresh one", async () => {
    await computeSuggestion({ projectId: w.project.id, itemId: w.ids[93] });
    const rebuilds = peekEngine(w.project.id)!.stats.rebuilds;
    // A label written without its log row, then the version moved by hand: an incremental pass could not see the item.
    await addLabel(w, 94, w.users.annA.id, 2, false);
    await db.execute(sql`update knn_state set version = version + 1 where project_id = ${w.project.id}`);
    const seen = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[95] });
    expect(peekEngine(w.project.id)!.stats.rebuilds).toBe(rebuilds + 1);
    expect(peekEngine(w.project.id)!.index!.has(w.ids[94])).toBe(true);
    clearEngineCache(w.project.id);
    const fresh = await computeSuggestion({ projectId: w.project.id, itemId: w.ids[95] });
    expect(seen.neighbours).toEqual(fresh.neighbours);
    expect(seen.shares).toEqual(fresh.shares);
  });

  it(`prunes rows ${CHANGE_LOG_KEEP} versions back on every 1000th version`, async () => {
    // Jump the version to just below a multiple of 1000, with one ancient and one recent row already logged.
    const target = Math.ceil(((await version()) + CHANGE_LOG_KEEP + 10) / 1000) * 1000;
    await db.transaction(async (tx) => {
      // Rows with chosen versions: this transaction alone skips the stamping trigger.
      await tx.execute(sql`set local session_replication_role = replica`);
      await tx.insert(knnChanges).values([
        { projectId: w.project.id, itemId: w.ids[5], version: target - CHANGE_LOG_KEEP - 5 },
        { projectId: w.project.id, itemId: w.ids[6], version: target - CHANGE_LOG_KEEP + 5 },
      ]);
    });
    await db.update(knnState).set({ version: target - 1 }).where(eq(knnState.projectId, w.project.id));
    await db.transaction((tx) => markKnnChanged(tx, w.project.id, [w.ids[7]]));
    expect(await version()).toBe(target);
    const left = await db.select().from(knnChanges).where(eq(knnChanges.projectId, w.project.id));
    expect(left.some((r) => r.version === target - CHANGE_LOG_KEEP - 5)).toBe(false);
    expect(left.some((r) => r.version === target - CHANGE_LOG_KEEP + 5)).toBe(true);
    expect(left.some((r) => r.version === target && r.itemId === w.ids[7])).toBe(true);
  });

  it("rejects item ids that are not integers", async () => {
    await expect(db.transaction((tx) => markKnnChanged(tx, w.project.id, [1.5]))).rejects.toThrow(/integers/);
  });
});
