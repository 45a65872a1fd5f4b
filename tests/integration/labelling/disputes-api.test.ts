// Disputes and Rulings through the real server: roles, names, filters, doubts, the ruling race, audit and the digest.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool } from "@/db";
import { disputes } from "@/db/schema";
import { getBoss } from "@/lib/jobs/boss";
import { runDisputeDigest } from "@/lib/labelling/digest";
import { api, waitForMail } from "../../support/http";
import { makeLabellingWorld, member } from "./world";

let ana: Awaited<ReturnType<typeof member>>;
let ben: Awaited<ReturnType<typeof member>>;
let rhea: Awaited<ReturnType<typeof member>>;
let rolf: Awaited<ReturnType<typeof member>>;
let owner: Awaited<ReturnType<typeof member>>;
let viewer: Awaited<ReturnType<typeof member>>;

beforeAll(async () => {
  [ana, ben, rhea, rolf, owner, viewer] = await Promise.all([
    member("annotator", "Ana Annotator"),
    member("annotator", "Ben Annotator"),
    member("reviewer", "Rhea Reviewer"),
    member("reviewer", "Rolf Reviewer"),
    member("owner", "Olga Owner"),
    member("viewer", "Vic Viewer"),
  ]);
});
afterAll(async () => {
  await (await getBoss()).stop({ graceful: false }).catch(() => undefined);
  await pool.end();
});

async function disputedWorld(pairs: Array<[number, number]>, settings = {}) {
  const w = await makeLabellingWorld({ n: pairs.length + 1, settings: { overlap: 2, ...settings }, members: [ana, ben, rhea, rolf, owner, viewer] });
  for (const [i, [a, b]] of pairs.entries()) {
    for (const [who, c] of [[ana, a], [ben, b]] as const) {
      const r = await api(`/api/v1/projects/${w.project.id}/items/${w.items[i].id}/labels`, { token: who.token, body: { clientSubmissionId: randomUUID(), classId: w.classes[c].id } });
      expect(r.status).toBe(201);
    }
  }
  return w;
}

describe("Disputes", () => {
  it("is for reviewers and owners only; annotators and viewers get 403", async () => {
    const w = await disputedWorld([[0, 1]]);
    for (const who of [ana, viewer]) {
      const r = await api(`/api/v1/projects/${w.project.id}/disputes`, { token: who.token });
      expect(r.status).toBe(403);
      expect(r.text).not.toContain("Ben Annotator");
    }
    const asOwner = await api(`/api/v1/projects/${w.project.id}/disputes`, { token: owner.token });
    expect(asOwner.status).toBe(200);
    const list = await api(`/api/v1/projects/${w.project.id}/disputes`, { token: rhea.token });
    expect(list.status).toBe(200);
    expect(list.json.total).toBe(1);
    expect(list.json.data[0].labels.map((l: { annotatorName: string }) => l.annotatorName).sort()).toEqual(["Ana Annotator", "Ben Annotator"]);
    const detail = await api(`/api/v1/projects/${w.project.id}/disputes/${list.json.data[0].id}`, { token: rhea.token });
    expect(detail.status).toBe(200);
    expect(detail.json.data.item.externalId).toBe(w.items[0].externalId);
    expect(detail.json.data.ruling).toBeNull();
    expect((await api(`/api/v1/projects/${w.project.id}/disputes/${list.json.data[0].id}`, { token: ben.token })).status).toBe(403);
    const other = await disputedWorld([[1, 2]]);
    expect((await api(`/api/v1/projects/${other.project.id}/disputes/${list.json.data[0].id}`, { token: rhea.token })).status).toBe(404);
  });

  it("filters by class pair and by age", async () => {
    const w = await disputedWorld([[0, 1], [1, 2], [0, 2]]);
    const c = w.classes.map((x) => x.id);
    const base = `/api/v1/projects/${w.project.id}/disputes`;
    const pair = await api(`${base}?classA=${c[0]}&classB=${c[1]}`, { token: rhea.token });
    expect(pair.json.data.map((d: { itemId: number }) => d.itemId)).toEqual([w.items[0].id]);
    const one = await api(`${base}?classA=${c[2]}`, { token: rhea.token });
    expect(one.json.total).toBe(2);
    expect(pair.json.pairs).toHaveLength(3);
    await db.execute(sql`update disputes set opened_at = now() - interval '3 days' where item_id = ${w.items[1].id}`);
    const old = await api(`${base}?minAgeHours=24`, { token: rhea.token });
    expect(old.json.data.map((d: { itemId: number }) => d.itemId)).toEqual([w.items[1].id]);
    const fresh = await api(`${base}?maxAgeHours=24`, { token: rhea.token });
    expect(fresh.json.total).toBe(2);
    const bad = await api(`${base}?minAgeHours=48&maxAgeHours=24`, { token: rhea.token });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields[0].path).toBe("minAgeHours");
  });

  it("lets exactly one of two simultaneous rulings win; the other gets 409 with the ruling that stands", async () => {
    const w = await disputedWorld([[0, 1]]);
    const [d] = (await api(`/api/v1/projects/${w.project.id}/disputes`, { token: rhea.token })).json.data;
    const url = `/api/v1/projects/${w.project.id}/disputes/${d.id}/ruling`;
    const [r1, r2] = await Promise.all([
      api(url, { token: rhea.token, body: { classId: w.classes[0].id, reason: "pit depth says so" } }),
      api(url, { token: rolf.token, body: { classId: w.classes[1].id, reason: "wall loss says otherwise" } }),
    ]);
    expect([r1.status, r2.status].sort()).toEqual([201, 409]);
    const [won, lost] = r1.status === 201 ? [r1, r2] : [r2, r1];
    expect(lost.json.error.code).toBe("conflict:already_ruled");
    expect(lost.json.error.message).toMatch(/already ruled/);
    expect(lost.json.error.details.ruling.id).toBe(won.json.data.id);
    const item = (await db.execute<{ status: string; final_class_id: number; final_source: string }>(sql`select status, final_class_id, final_source from items where id = ${w.items[0].id}`)).rows[0];
    expect(item).toEqual({ status: "ruled", final_class_id: won.json.data.classId, final_source: "ruling" });
    const audit = await db.execute<{ n: number }>(sql`select count(*)::int as n from audit_log where project_id = ${w.project.id} and action = 'dispute.ruling'`);
    expect(audit.rows[0].n).toBe(1);
    const ruled = await api(`/api/v1/projects/${w.project.id}/disputes?status=ruled`, { token: rhea.token });
    expect(ruled.json.total).toBe(1);
    expect((await api(`/api/v1/projects/${w.project.id}/disputes`, { token: rhea.token })).json.total).toBe(0);
  });

  it("rejects a ruling without a reason (422), with a foreign class (400), and from an annotator (403)", async () => {
    const w = await disputedWorld([[0, 2]]);
    const other = await makeLabellingWorld({ n: 1, members: [] });
    const [d] = (await api(`/api/v1/projects/${w.project.id}/disputes`, { token: rhea.token })).json.data;
    const url = `/api/v1/projects/${w.project.id}/disputes/${d.id}/ruling`;
    const noReason = await api(url, { token: rhea.token, body: { classId: w.classes[0].id } });
    expect(noReason.status).toBe(422);
    expect(noReason.json.error.fields[0].path).toBe("reason");
    expect((await api(url, { token: rhea.token, body: { classId: other.classes[0].id, reason: "looks right" } })).status).toBe(400);
    expect((await api(url, { token: ana.token, body: { classId: w.classes[0].id, reason: "mine" } })).status).toBe(403);
  });

  it("shows doubts (no disagreement) with the current final label, and a ruling replaces it", async () => {
    const w = await disputedWorld([]);
    const item = w.items[0];
    await db.execute(sql`update items set status = 'agreed', final_class_id = ${w.classes[0].id}, final_source = 'agreed', label_count = 2 where id = ${item.id}`);
    const [doubt] = await db.insert(disputes).values({ projectId: w.project.id, itemId: item.id, reason: "doubt", openedBy: owner.user.id, note: "neighbours vote otherwise" }).returning();
    const list = await api(`/api/v1/projects/${w.project.id}/disputes?reason=doubt`, { token: rhea.token });
    expect(list.json.data).toHaveLength(1);
    expect(list.json.data[0]).toMatchObject({ reason: "doubt", finalClassId: w.classes[0].id, labels: [] });
    const r = await api(`/api/v1/projects/${w.project.id}/disputes/${doubt.id}/ruling`, { token: rhea.token, body: { classId: w.classes[2].id, reason: "measurements match the third class" } });
    expect(r.status).toBe(201);
    const after = (await db.execute<{ final_class_id: number; final_source: string; status: string }>(sql`select final_class_id, final_source, status from items where id = ${item.id}`)).rows[0];
    expect(after).toEqual({ final_class_id: w.classes[2].id, final_source: "ruling", status: "ruled" });
  });
});

describe("the dispute digest", () => {
  it("queues a digest job at the threshold and e-mails each reviewer a link to Disputes, at most hourly", async () => {
    const w = await disputedWorld([[0, 1], [1, 2]], { disputeDigestThreshold: 2 });
    const jobs = await db.execute<{ n: number }>(sql`select count(*)::int as n from pgboss.job where name = 'dispute-digest' and data->>'projectId' = ${String(w.project.id)}`);
    expect(jobs.rows[0].n).toBe(1);
    // The worker may already have run the queued job; either way each reviewer gets exactly this digest.
    const first = await runDisputeDigest(w.project.id);
    if (!first.skipped) expect(first.sent.sort()).toEqual([rhea.user.email, rolf.user.email].sort());
    else expect(first.skipped).toBe("sent_recently");
    for (const who of [rhea, rolf]) {
      const mail = await waitForMail(who.user.email, /2 disputes wait/);
      expect(mail.text).toContain(`/projects/${w.project.id}/disputes`);
    }
    await expect(waitForMail(ana.user.email, /disputes wait/, 1_000)).rejects.toThrow();
    const second = await runDisputeDigest(w.project.id);
    expect(second.skipped).toBe("sent_recently");
  });

  it("does not send below the threshold", async () => {
    const w = await disputedWorld([[0, 1]], { disputeDigestThreshold: 5 });
    expect((await runDisputeDigest(w.project.id)).skipped).toBe("below_threshold");
    const jobs = await db.execute<{ n: number }>(sql`select count(*)::int as n from pgboss.job where name = 'dispute-digest' and data->>'projectId' = ${String(w.project.id)}`);
    expect(jobs.rows[0].n).toBe(0);
  });
});
