// The engine's REST routes on the running app: roles, 404 for other projects' items, blind items, Doubts → Disputes.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pool } from "@/db";
import { makeProject, makeToken, makeUser } from "@/tests/support/fixtures";
import { api } from "@/tests/support/http";
import { suggestionResponseSchema } from "@/app/api/v1/projects/[projectId]/items/[itemId]/suggestion/schema";
import { buildWorld, type World } from "./world";

let w: World;
const t: Record<string, string> = {};
let otherItemProject: number;
beforeAll(async () => {
  w = await buildWorld({ seed: 3 });
  for (const [name, u] of Object.entries(w.users)) t[name] = (await makeToken(u.id)).secret;
  const outsider = await makeUser();
  t.outsider = (await makeToken(outsider.id)).secret;
  otherItemProject = (await makeProject({ members: [{ userId: outsider.id, role: "owner" }] })).project.id;
});
afterAll(async () => {
  await pool.end();
});

const sug = (i: number, projectId = w.project.id) => `/api/v1/projects/${projectId}/items/${w.ids[i]}/suggestion`;

describe("GET …/items/{itemId}/suggestion", () => {
  it("gives an annotator the vote shares of every class and the neighbours", async () => {
    const r = await api(sug(100), { token: t.annA });
    expect(r.status).toBe(200);
    const body = suggestionResponseSchema.parse(r.json.data);
    if (body.blind) throw new Error("item 100 is not blind");
    expect(Object.keys(body.shares).sort()).toEqual(w.classes.map((c) => String(c.id)).sort());
    expect(Object.values(body.shares).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 9);
    expect(body.neighbours).toHaveLength(5);
    expect(body.neighbours[0].externalId).toMatch(/^IT-/);
    expect(body.neighbours[0].fields).toHaveProperty("note");
  });

  it("hides the suggestion of a blind-share item from annotators, not from the owner or reviewer", async () => {
    const blind = 99; // i % 10 === 9 → blind in world.ts
    const a = await api(sug(blind), { token: t.annA });
    expect(a.status).toBe(200);
    expect(a.json.data).toEqual({ itemId: w.ids[blind], blind: true });
    for (const who of ["owner", "reviewer"]) {
      const r = await api(sug(blind), { token: t[who] });
      expect(r.status).toBe(200);
      expect(r.json.data.blind).toBe(false);
      expect(r.json.data.neighbours.length).toBe(5);
    }
  });

  it("refuses viewers (403), hides the project from outsiders (404) and another project's items (404)", async () => {
    expect((await api(sug(100), { token: t.viewer })).status).toBe(403);
    expect((await api(sug(100), { token: t.outsider })).status).toBe(404);
    const cross = await api(sug(100, otherItemProject), { token: t.outsider });
    expect(cross.status).toBe(404);
    expect(cross.json.error.code).toBe("not_found:item");
    expect((await api(`/api/v1/projects/${w.project.id}/items/abc/suggestion`, { token: t.owner })).status).toBe(404);
    expect((await api(sug(100))).status).toBe(401);
  });
});

describe("Tuning, Doubts and Map routes", () => {
  it("Tuning: owner only; a small set computes inline; GET reads the latest", async () => {
    expect((await api(`/api/v1/projects/${w.project.id}/tuning`, { token: t.reviewer, body: {} })).status).toBe(403);
    expect((await api(`/api/v1/projects/${w.project.id}/tuning`, { token: t.owner, body: { extra: 1 } })).status).toBe(422);
    const post = await api(`/api/v1/projects/${w.project.id}/tuning`, { token: t.owner, body: {} });
    expect(post.status).toBe(201);
    expect(post.json.data.report.status).toBe("succeeded");
    const get = await api(`/api/v1/projects/${w.project.id}/tuning`, { token: t.owner });
    expect(get.json.data.report.result.results).toHaveLength(78);
    expect(get.json.data.settings.k).toBe(5);
  });

  it("Doubts: lists, sends one item to Disputes (201), then answers 409 for the same item", async () => {
    expect((await api(`/api/v1/projects/${w.project.id}/doubts`, { token: t.annA })).status).toBe(403);
    const list = await api(`/api/v1/projects/${w.project.id}/doubts`, { token: t.owner });
    expect(list.status).toBe(200);
    const first = list.json.data.report.result.doubts[0];
    expect(list.json.data.items[String(first.itemId)].externalId).toMatch(/^IT-/);
    const path = `/api/v1/projects/${w.project.id}/doubts/${first.itemId}/dispute`;
    expect((await api(path, { token: t.owner, body: { note: "x".repeat(1001) } })).status).toBe(422);
    const sent = await api(path, { token: t.owner, body: { note: "neighbours disagree" } });
    expect(sent.status).toBe(201);
    expect(sent.json.data.reason).toBe("doubt");
    const again = await api(path, { token: t.owner, body: {} });
    expect(again.status).toBe(409);
    expect(again.json.error.message).toMatch(/already has an open dispute/);
    const after = await api(`/api/v1/projects/${w.project.id}/doubts`, { token: t.owner });
    expect(after.json.data.openDisputes).toContain(first.itemId);
    expect((await api(`/api/v1/projects/${w.project.id}/doubts/${w.ids[0]}/dispute`, { token: t.outsider, body: {} })).status).toBe(404);
  });

  it("Map: viewers may read it; the method and sampling are stated", async () => {
    const r = await api(`/api/v1/projects/${w.project.id}/map`, { token: t.viewer });
    expect(r.status).toBe(200);
    const m = r.json.data.report.result;
    expect(m.points).toHaveLength(120);
    expect(m.method).toMatch(/PCA/);
    expect(m.sampling).toMatch(/seed/);
    expect((await api(`/api/v1/projects/${w.project.id}/map`, { token: t.outsider })).status).toBe(404);
  });
});
