// The Desk's REST routes against the real server: leases, idempotent labels, undo window, skip/flag, sync and roles.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { Client } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { env } from "@/lib/env";
import { api } from "../../support/http";
import { makeLabellingWorld, member } from "./world";

type World = Awaited<ReturnType<typeof makeLabellingWorld>>;
let ana: Awaited<ReturnType<typeof member>>;
let ben: Awaited<ReturnType<typeof member>>;
let cyd: Awaited<ReturnType<typeof member>>;
let rev: Awaited<ReturnType<typeof member>>;
let viewer: Awaited<ReturnType<typeof member>>;

beforeAll(async () => {
  [ana, ben, cyd, rev, viewer] = await Promise.all([member("annotator", "Ana"), member("annotator", "Ben"), member("annotator", "Cyd"), member("reviewer", "Rhea"), member("viewer", "Vic")]);
});
afterAll(async () => {
  await pool.end();
});

const world = (n: number, overlap: number, extra: Parameters<typeof makeLabellingWorld>[0]["blind"] = []) =>
  makeLabellingWorld({ n, settings: { overlap }, members: [ana, ben, cyd, rev, viewer], blind: extra });
const next = (w: World, token: string, exclude: number[] = []) => api(`/api/v1/projects/${w.project.id}/desk/next${exclude.length ? `?exclude=${exclude.join(",")}` : ""}`, { token });
const label = (w: World, token: string, itemId: number, classId: number, extra: Record<string, unknown> = {}) =>
  api(`/api/v1/projects/${w.project.id}/items/${itemId}/labels`, { token, body: { clientSubmissionId: randomUUID(), classId, ...extra } });

describe("leases", () => {
  it("hands out items in queue order, returns a held lease again, and prefetches a different one", async () => {
    const w = await world(5, 2);
    const a = await next(w, ana.token);
    expect(a.status).toBe(200);
    expect(a.json.data.itemId).toBe(w.items[0].id);
    expect(a.json.data.fields.length_mm).toBeTypeOf("number");
    expect((await next(w, ana.token)).json.data.itemId).toBe(w.items[0].id);
    expect((await next(w, ana.token, [w.items[0].id])).json.data.itemId).toBe(w.items[1].id);
    const held = await db.execute<{ n: number }>(sql`select count(*)::int as n from assignments where user_id = ${ana.user.id} and leased_until > now()`);
    expect(held.rows[0].n).toBe(2);
  });

  it("never gives the last free slot to two annotators, and frees it when the lease expires", async () => {
    const w = await world(2, 1);
    const a = await next(w, ana.token);
    const b = await next(w, ben.token);
    expect(a.json.data.itemId).toBe(w.items[0].id);
    expect(b.json.data.itemId).toBe(w.items[1].id);
    expect((await next(w, cyd.token)).json.data).toBeNull();
    // Labelling a slot someone else holds is refused.
    const stolen = await label(w, cyd.token, w.items[0].id, w.classes[0].id);
    expect(stolen.status).toBe(409);
    expect(stolen.json.error.code).toBe("conflict:item_full");
    await db.execute(sql`update assignments set leased_until = now() - interval '1 second' where user_id = ${ana.user.id} and item_id = ${w.items[0].id}`);
    expect((await next(w, cyd.token)).json.data.itemId).toBe(w.items[0].id);
    const lease = await db.execute<{ secs: number }>(sql`select extract(epoch from leased_until - now())::float8 as secs from assignments where user_id = ${cyd.user.id}`);
    expect(lease.rows[0].secs).toBeGreaterThan(env.LEASE_SECONDS - 30);
    expect(lease.rows[0].secs).toBeLessThanOrEqual(env.LEASE_SECONDS);
  });

  it("skips an item whose row another transaction holds locked instead of waiting for it", async () => {
    const w = await world(3, 2);
    const locker = new Client({ connectionString: env.DATABASE_URL });
    await locker.connect();
    try {
      await locker.query("begin");
      await locker.query("select id from items where id = $1 for update", [w.items[0].id]);
      const t0 = Date.now();
      const a = await next(w, ana.token);
      expect(a.json.data.itemId).toBe(w.items[1].id);
      expect(Date.now() - t0).toBeLessThan(5_000);
    } finally {
      await locker.query("rollback");
      await locker.end();
    }
  });

  it("answers 403 to viewers, 404 to outsiders and 422 to a malformed exclude list", async () => {
    const w = await world(1, 1);
    expect((await next(w, viewer.token)).status).toBe(403);
    const outsider = await member("annotator");
    expect((await next(w, outsider.token)).status).toBe(404);
    const bad = await api(`/api/v1/projects/${w.project.id}/desk/next?exclude=1,abc`, { token: ana.token });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("exclude");
  });
});

describe("labels", () => {
  it("claims one pool re-ranking when the project's label events reach poolRerankEvery, and not before", async () => {
    const w = await makeLabellingWorld({ n: 8, settings: { overlap: 1, poolRerankEvery: 5 }, members: [ana, ben, cyd, rev, viewer] });
    const since = async () => (await db.execute<{ n: number }>(sql`select labels_since_pool_rank as n from knn_state where project_id = ${w.project.id}`)).rows[0].n;
    const seen: number[] = [];
    for (let i = 0; i < 6; i += 1) {
      const itemId = (await next(w, ana.token)).json.data.itemId;
      expect((await label(w, ana.token, itemId, w.classes[0].id)).status).toBe(201);
      seen.push(await since());
    }
    // The fifth label's answer comes after its claim: the counter is back to 0, and counts on from there.
    expect(seen).toEqual([1, 2, 3, 4, 0, 1]);
  });

  it("stores a retried submission once and refuses the id on another item", async () => {
    const w = await world(3, 2);
    const itemId = (await next(w, ana.token)).json.data.itemId;
    const body = { clientSubmissionId: randomUUID(), classId: w.classes[1].id };
    const url = `/api/v1/projects/${w.project.id}/items/${itemId}/labels`;
    const [r1, r2] = await Promise.all([api(url, { token: ana.token, body }), api(url, { token: ana.token, body })]);
    expect([r1.status, r2.status].sort()).toEqual([200, 201]);
    expect(r1.json.data.label.id).toBe(r2.json.data.label.id);
    const r3 = await api(url, { token: ana.token, body });
    expect(r3.status).toBe(200);
    expect(r3.json.data.replayed).toBe(true);
    const stored = await db.execute<{ n: number }>(sql`select count(*)::int as n from labels where item_id = ${itemId}`);
    expect(stored.rows[0].n).toBe(1);
    const other = await api(`/api/v1/projects/${w.project.id}/items/${w.items[2].id}/labels`, { token: ana.token, body });
    expect(other.status).toBe(409);
    expect(other.json.error.code).toBe("conflict:submission_reused");
    const again = await label(w, ana.token, itemId, w.classes[0].id);
    expect(again.status).toBe(409);
    expect(again.json.error.code).toBe("conflict:already_labelled");
  });

  it("validates input: 422 with the field, 400 for a class of another project, 404 for another project's item", async () => {
    const w = await world(1, 1);
    const other = await world(1, 1);
    const url = `/api/v1/projects/${w.project.id}/items/${w.items[0].id}/labels`;
    const missing = await api(url, { token: ana.token, body: { classId: w.classes[0].id } });
    expect(missing.status).toBe(422);
    expect(missing.json.error.fields.map((f: { path: string }) => f.path)).toContain("clientSubmissionId");
    const wrongType = await api(url, { token: ana.token, body: { clientSubmissionId: randomUUID(), classId: "two" } });
    expect(wrongType.status).toBe(422);
    expect(wrongType.json.error.fields[0].path).toBe("classId");
    const foreignClass = await label(w, ana.token, w.items[0].id, other.classes[0].id);
    expect(foreignClass.status).toBe(400);
    expect(foreignClass.json.error.message).toMatch(/classId/);
    const foreignItem = await label(w, ana.token, other.items[0].id, w.classes[0].id);
    expect(foreignItem.status).toBe(404);
    const forgedToken = await label(w, ana.token, w.items[0].id, w.classes[0].id, { suggestionToken: "eyJ4IjoxfQ.AAAAAAAAAAAAAAAAAAAAAA" });
    expect(forgedToken.status).toBe(400);
  });

  it("reaches consensus at overlap: unanimous → agreed final label; disagreement → open dispute", async () => {
    const w = await world(2, 2);
    const [x, y] = w.items;
    for (const t of [ana, ben]) expect((await label(w, t.token, x.id, w.classes[0].id)).status).toBe(201);
    expect((await label(w, ana.token, y.id, w.classes[0].id)).status).toBe(201);
    expect((await label(w, ben.token, y.id, w.classes[2].id)).status).toBe(201);
    const rows = await db.execute<{ id: number; status: string; final_class_id: number | null; final_source: string | null; label_count: number; disputes: number }>(sql`
      select id, status, final_class_id, final_source, label_count, (select count(*)::int from disputes d where d.item_id = i.id and d.status = 'open' and d.reason = 'disagreement') as disputes
      from items i where id in (${x.id}, ${y.id}) order by id`);
    expect(rows.rows[0]).toMatchObject({ status: "agreed", final_class_id: w.classes[0].id, final_source: "agreed", label_count: 2, disputes: 0 });
    expect(rows.rows[1]).toMatchObject({ status: "disputed", final_class_id: null, label_count: 2, disputes: 1 });
    expect((await label(w, cyd.token, y.id, w.classes[1].id)).status).toBe(409);
  });

  it("marks a single label final as 'single' when overlap is 1", async () => {
    const w = await world(1, 1);
    expect((await label(w, ana.token, w.items[0].id, w.classes[2].id)).status).toBe(201);
    const [row] = (await db.execute<{ status: string; final_source: string }>(sql`select status, final_source from items where id = ${w.items[0].id}`)).rows;
    expect(row).toEqual({ status: "agreed", final_source: "single" });
  });

  it("undoes within the window (reverting consensus) and refuses after it", async () => {
    const w = await world(2, 2);
    const [x, y] = w.items;
    await label(w, ana.token, x.id, w.classes[0].id);
    await label(w, ben.token, x.id, w.classes[1].id);
    const undo = await api(`/api/v1/projects/${w.project.id}/items/${x.id}/labels`, { token: ben.token, method: "DELETE" });
    expect(undo.status).toBe(200);
    expect(undo.json.data.label.undoneAt).not.toBeNull();
    const after = (await db.execute<{ status: string; label_count: number; open: number }>(sql`
      select status, label_count, (select count(*)::int from disputes d where d.item_id = i.id) as open from items i where id = ${x.id}`)).rows[0];
    expect(after).toEqual({ status: "in_progress", label_count: 1, open: 0 });
    // The undone item is leased back to its annotator, who labels it again.
    expect((await next(w, ben.token)).json.data.itemId).toBe(x.id);
    expect((await label(w, ben.token, x.id, w.classes[0].id)).status).toBe(201);
    expect((await db.execute<{ status: string }>(sql`select status from items where id = ${x.id}`)).rows[0].status).toBe("agreed");

    await label(w, ana.token, y.id, w.classes[0].id);
    await db.execute(sql`update labels set created_at = now() - interval '11 seconds' where item_id = ${y.id} and annotator_id = ${ana.user.id}`);
    const late = await api(`/api/v1/projects/${w.project.id}/items/${y.id}/labels`, { token: ana.token, method: "DELETE" });
    expect(late.status).toBe(409);
    expect(late.json.error.code).toBe("conflict:undo_window");
    const none = await api(`/api/v1/projects/${w.project.id}/items/${y.id}/labels`, { token: cyd.token, method: "DELETE" });
    expect(none.status).toBe(404);
  });

  it("stores the suggestion shown and the Take; blind items get none and store shown = false", async () => {
    const w = await makeLabellingWorld({ n: 12, settings: { overlap: 1 }, members: [ana, ben], blind: [11] });
    for (let i = 0; i < 9; i += 1) await label(w, ben.token, w.items[i].id, w.classes[i % 3].id);
    const shown = (await next(w, ana.token)).json.data;
    expect(shown.itemId).toBe(w.items[9].id);
    expect(shown.suggestion.topClassId).not.toBeNull();
    expect(Object.keys(shown.suggestion.shares).sort()).toEqual(w.classes.map((c) => String(c.id)).sort());
    const badTake = await label(w, ana.token, shown.itemId, w.classes.find((c) => c.id !== shown.suggestion.topClassId)!.id, { via: "take", suggestionToken: shown.suggestionToken });
    expect(badTake.status).toBe(400);
    const take = await label(w, ana.token, shown.itemId, shown.suggestion.topClassId, { via: "take", suggestionToken: shown.suggestionToken });
    expect(take.status).toBe(201);
    expect(take.json.data.label.tookSuggestion).toBe(true);
    await label(w, ana.token, w.items[10].id, w.classes[0].id);
    const blind = (await next(w, ana.token)).json.data;
    expect(blind.itemId).toBe(w.items[11].id);
    expect(blind.suggestion).toBeNull();
    expect(blind.suggestionToken).toBeNull();
    expect((await label(w, ana.token, blind.itemId, w.classes[0].id, { via: "take" })).status).toBe(400);
    expect((await label(w, ana.token, blind.itemId, w.classes[0].id)).status).toBe(201);
    const rows = (await db.execute<{ item_id: number; took_suggestion: boolean; suggestion: { shown: boolean; topClassId: number | null; knnVersion: number; engineVersion: string } | null }>(sql`
      select item_id, took_suggestion, suggestion from labels where item_id in (${shown.itemId}, ${blind.itemId}) order by item_id`)).rows;
    expect(rows[0].took_suggestion).toBe(true);
    expect(rows[0].suggestion).toMatchObject({ shown: true, topClassId: shown.suggestion.topClassId });
    expect(rows[0].suggestion!.engineVersion).toMatch(/./);
    expect(rows[1].took_suggestion).toBe(false);
    expect(rows[1].suggestion?.shown).toBe(false);
  });
});

describe("skip, flag, counters and sync", () => {
  it("skips and flags (comment required) and never shows those items to that annotator again", async () => {
    const w = await world(3, 2);
    const url = (i: number) => `/api/v1/projects/${w.project.id}/items/${w.items[i].id}/flags`;
    expect((await api(url(0), { token: ana.token, body: { kind: "skip" } })).status).toBe(201);
    const noComment = await api(url(1), { token: ana.token, body: { kind: "flag" } });
    expect(noComment.status).toBe(422);
    expect(noComment.json.error.fields[0].path).toBe("comment");
    expect((await api(url(1), { token: ana.token, body: { kind: "flag", comment: "reading looks corrupted" } })).status).toBe(201);
    expect((await next(w, ana.token)).json.data.itemId).toBe(w.items[2].id);
    expect((await next(w, ben.token)).json.data.itemId).toBe(w.items[0].id);
  });

  it("counts done today and what remains", async () => {
    const w = await world(4, 2);
    await label(w, ana.token, w.items[0].id, w.classes[0].id);
    await label(w, ana.token, w.items[1].id, w.classes[0].id);
    await label(w, ben.token, w.items[1].id, w.classes[0].id);
    const s = await api(`/api/v1/projects/${w.project.id}/desk/stats?tz=Europe/Berlin`, { token: ana.token });
    expect(s.status).toBe(200);
    expect(s.json.data).toMatchObject({ doneToday: 2, remainingItems: 3, openSlots: 5, remainingForYou: 2, overlap: 2 });
    expect((await api(`/api/v1/projects/${w.project.id}/desk/stats?tz=Mars/Olympus`, { token: ana.token })).status).toBe(422);
  });

  it("syncs settled labels by signed cursor; names only for reviewers", async () => {
    const w = await world(3, 2);
    for (const i of [0, 1]) await label(w, ana.token, w.items[i].id, w.classes[0].id);
    await db.execute(sql`update labels set created_at = now() - interval '30 seconds' where project_id = ${w.project.id}`);
    await label(w, ben.token, w.items[2].id, w.classes[1].id);
    const url = `/api/v1/projects/${w.project.id}/labels`;
    const asViewer = await api(`${url}?limit=1`, { token: viewer.token });
    expect(asViewer.status).toBe(200);
    expect(asViewer.json.data).toHaveLength(1);
    expect(asViewer.json.data[0].annotator).toBeUndefined();
    expect(asViewer.text).not.toContain("Ana");
    expect(asViewer.text).not.toContain(ana.user.id);
    const page2 = await api(`${url}?limit=5&since=${encodeURIComponent(asViewer.json.next)}`, { token: viewer.token });
    expect(page2.json.data).toHaveLength(1);
    expect(page2.json.data[0].id).toBeGreaterThan(asViewer.json.data[0].id);
    expect(page2.json.data[0].annotatorKey).toBe(asViewer.json.data[0].annotatorKey);
    const page3 = await api(`${url}?since=${encodeURIComponent(page2.json.next)}`, { token: viewer.token });
    expect(page3.json.data).toEqual([]);
    const asReviewer = await api(url, { token: rev.token });
    expect(asReviewer.json.data[0].annotator).toEqual({ id: ana.user.id, name: "Ana" });
    const tampered = await api(`${url}?since=${encodeURIComponent(asViewer.json.next.replace(/^./, "x"))}`, { token: viewer.token });
    expect(tampered.status).toBe(400);
  });
});
