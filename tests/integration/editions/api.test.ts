// Editions end to end against the real app, database and fake S3: publish, build (job run in-process), download, diff, delete.
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { parquetReadObjects } from "hyparquet";
import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditLog, editions, items } from "@/db/schema";
import { splitSizes } from "@/lib/editions/split";
import { api, waitForMail } from "../../support/http";
import { type Expected, extId, makeEditionWorld, runEditionJob } from "./world";

type World = Awaited<ReturnType<typeof makeEditionWorld>>;

async function fetchBytes(url: string) {
  const res = await fetch(url);
  expect(res.status, url).toBe(200);
  return new Uint8Array(await res.arrayBuffer());
}
const sha256 = (b: Uint8Array) => createHash("sha256").update(b).digest("hex");
const csvRecords = (bytes: Uint8Array) => {
  const parsed = Papa.parse<Record<string, string>>(new TextDecoder().decode(bytes), { header: true, skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
};
/** Undo the formula neutralising for comparison with the stored external id. */
const plain = (cell: string) => (/^'[=+\-@\t\r]/.test(cell) ? cell.slice(1) : cell);

describe("editions API", () => {
  let w: World;
  let first: { id: number; number: number };
  const base = () => `/api/v1/projects/${w.project.id}/editions`;
  const owner = () => ({ token: w.tokens.owner.secret });

  beforeAll(async () => {
    w = await makeEditionWorld();
  });

  it("lets only owners publish: viewers 403, outsiders 404, bad options 422", async () => {
    expect((await api(base(), { token: w.tokens.viewer.secret, body: {} })).status).toBe(403);
    expect((await api(base(), { token: w.tokens.reviewer.secret, body: {} })).status).toBe(403);
    expect((await api(base(), { token: w.tokens.outsider.secret, body: {} })).status).toBe(404);
    expect((await api(base(), { body: {} })).status).toBe(401);
    const bad = await api(base(), { ...owner(), body: { split: { seed: 1, train: 0.8, validation: 0.3, test: 0.1 } } });
    expect(bad.status).toBe(422);
    expect((await api(base(), { ...owner(), body: { include: [] } })).status).toBe(422);
  });

  it("publishes edition 1 (pending, audit-logged), and the job freezes it", async () => {
    const res = await api(base(), { ...owner(), body: { split: { seed: 42, train: 0.6, validation: 0.2, test: 0.2 } } });
    expect(res.status).toBe(202);
    expect(res.json.data.number).toBe(1);
    expect(["pending", "running", "succeeded"]).toContain(res.json.data.status);
    first = res.json.data;
    const audit = await db.select().from(auditLog).where(and(eq(auditLog.action, "edition.publish"), eq(auditLog.targetId, String(first.id))));
    expect(audit).toHaveLength(1);
    expect(audit[0].actorId).toBe(w.users.owner.id);
    await runEditionJob(first.id);
    const detail = await api(`${base()}/${first.id}`, { token: w.tokens.viewer.secret });
    expect(detail.status).toBe(200);
    expect(detail.json.data.status).toBe("succeeded");
  });

  it("records counts, k-NN settings, agreement, feature schema and split in the manifest", async () => {
    const m = (await api(`${base()}/${first.id}`, { token: w.tokens.viewer.secret })).json.data.manifest;
    const included = w.expected.filter((e) => e.source !== "disputed");
    expect(m.counts.rows).toBe(included.length);
    expect(m.counts.bySource).toEqual({ agreed: 15, ruling: 2, single: 3, control: 2, disputed: 0 });
    for (const name of ["alpha", "beta", "gamma"]) expect(m.counts.byClass[name]).toBe(included.filter((e) => e.label === name).length);
    expect(m.knn).toMatchObject({ k: 7, distance: "euclidean" });
    expect(m.agreement.labels).toBe(15 * 2 + 3 + 2 * 2 + 3 * 2 + 2);
    expect(m.agreement.krippendorffAlpha).toHaveProperty("value");
    expect(m.featureSchema.columns.map((c: { name: string }) => c.name)).toEqual(["x", "y", "colour"]);
    expect(m.split).toMatchObject({ seed: 42, fractions: { train: 0.6, validation: 0.2, test: 0.2 } });
    expect(m.createdBy).toEqual({ id: w.users.owner.id });
    for (const name of ["alpha", "beta", "gamma"]) {
      const n = included.filter((e) => e.label === name).length;
      const [train, validation, test] = splitSizes(n, { train: 0.6, validation: 0.2, test: 0.2 });
      expect([m.counts.bySplit.train.byClass[name], m.counts.bySplit.validation.byClass[name], m.counts.bySplit.test.byClass[name]]).toEqual([train, validation, test]);
    }
  });

  it("downloads the CSV through a presigned URL: rows and labels equal the database, formulas neutralised, hash matches", async () => {
    const link = await api(`${base()}/${first.id}/download?format=csv`, { token: w.tokens.viewer.secret });
    expect(link.status).toBe(200);
    expect(Date.parse(link.json.expiresAt)).toBeGreaterThan(Date.now());
    expect(link.json.url).toContain("X-Amz-Signature");
    const bytes = await fetchBytes(link.json.url);
    const m = (await api(`${base()}/${first.id}`, owner())).json.data.manifest;
    expect(sha256(bytes)).toBe(m.files.csv.sha256);
    expect(bytes.length).toBe(m.files.csv.bytes);
    const rows = csvRecords(bytes);
    const dbRows = await db.select({ externalId: items.externalId, finalClassId: items.finalClassId, isControl: items.isControl, knownClassId: items.knownClassId }).from(items).where(eq(items.projectId, w.project.id));
    const name = new Map(w.classes.map((c) => [c.id, c.name]));
    const truth = new Map(dbRows.filter((r) => r.finalClassId !== null || r.isControl).map((r) => [r.externalId, name.get((r.finalClassId ?? r.knownClassId) as number)]));
    expect(rows.length).toBe(truth.size);
    for (const r of rows) expect(r.final_label, r.external_id).toBe(truth.get(plain(r.external_id)));
    const formula = rows.find((r) => plain(r.external_id) === "=1+1");
    expect(formula?.external_id).toBe("'=1+1");
    expect(rows.find((r) => plain(r.external_id) === "-item-04")?.external_id).toBe("'-item-04");
    const gamma = rows.find((r) => r.external_id === extId(5));
    expect(gamma?.["feature:colour"]).toBe("'=blue");
    expect(Number(rows.find((r) => r.external_id === extId(7))?.["feature:y"])).toBe(-7);
    expect(rows.find((r) => r.external_id === extId(7))?.[`label:${w.users.annotator.id}`]).toBe("beta");
    expect(Object.keys(rows[0]).some((h) => h.includes("@"))).toBe(false);
    expect(new Set(rows.map((r) => r.split))).toEqual(new Set(["train", "validation", "test"]));
  });

  it("downloads the Parquet and JSON Lines files: hyparquet reads the same rows, hashes match the manifest", async () => {
    const m = (await api(`${base()}/${first.id}`, owner())).json.data.manifest;
    const pq = await fetchBytes((await api(`${base()}/${first.id}/download?format=parquet`, owner())).json.url);
    expect(sha256(pq)).toBe(m.files.parquet.sha256);
    const rows = (await parquetReadObjects({ file: pq.buffer.slice(pq.byteOffset, pq.byteOffset + pq.byteLength) as ArrayBuffer })) as Array<Record<string, unknown>>;
    const included = w.expected.filter((e) => e.source !== "disputed");
    expect(rows.length).toBe(included.length);
    const want = new Map<string, Expected>(included.map((e) => [e.externalId, e]));
    for (const r of rows) {
      const e = want.get(r.external_id as string);
      expect(e, String(r.external_id)).toBeDefined();
      expect(r.final_label).toBe(e?.label);
      expect(r.label_source).toBe(e?.source);
      expect(r.is_blind).toBe(e?.blind);
      expect(r.is_control).toBe(e?.control);
    }
    const shown = rows.find((r) => r.external_id === extId(1));
    expect(shown?.vote_shares).toEqual({ [w.users.annotator.id]: { alpha: 0.2, beta: 0.6, gamma: 0.2 }, [w.rater.id]: { alpha: 0.2, beta: 0.6, gamma: 0.2 } });
    expect(rows.find((r) => r.external_id === extId(10))?.vote_shares).toBeNull();
    const jl = await fetchBytes((await api(`${base()}/${first.id}/download?format=jsonl`, owner())).json.url);
    expect(sha256(jl)).toBe(m.files.jsonl.sha256);
    const lines = new TextDecoder().decode(jl).trim().split("\n").map((l) => JSON.parse(l));
    expect(lines.length).toBe(included.length);
    expect(lines.find((l) => l.external_id === "=1+1")?.features).toEqual({ x: 1.5, y: -3, colour: "red" });
    const manifest = JSON.parse(new TextDecoder().decode(await fetchBytes((await api(`${base()}/${first.id}/download?format=manifest`, owner())).json.url)));
    expect(manifest).toEqual(m);
  });

  it("e-mails the owner that the edition is ready", async () => {
    const mail = await waitForMail(w.users.owner.email, /Edition 1 of .* is ready/);
    expect(mail.text).toContain(`/projects/${w.project.id}/editions`);
  });

  it("diffs edition 2 against edition 1: added, removed and relabelled, with a CSV list", async () => {
    const cls = w.classes;
    await db.update(items).set({ finalClassId: cls[0].id, finalSource: "ruling", status: "ruled" }).where(and(eq(items.projectId, w.project.id), eq(items.externalId, extId(1))));
    await db.update(items).set({ finalClassId: null, finalSource: null, status: "disputed" }).where(and(eq(items.projectId, w.project.id), eq(items.externalId, extId(2))));
    await db.update(items).set({ finalClassId: cls[2].id, finalSource: "single", status: "agreed" }).where(and(eq(items.projectId, w.project.id), eq(items.externalId, extId(26))));
    const res = await api(base(), { ...owner(), body: {} });
    expect(res.json.data.number).toBe(2);
    await runEditionJob(res.json.data.id);
    const diff = await api(`${base()}/${res.json.data.id}/diff?against=${first.id}`, { token: w.tokens.viewer.secret });
    expect(diff.status).toBe(200);
    expect(diff.json.data.counts).toEqual({ before: 22, after: 22, added: 1, removed: 1, relabelled: 1, unchanged: 20 });
    const byChange = Object.fromEntries(diff.json.data.changes.map((c: { change: string; externalId: string }) => [c.change, c.externalId]));
    expect(byChange).toEqual({ added: extId(26), removed: extId(2), relabelled: extId(1) });
    const link = await api(`${base()}/${res.json.data.id}/diff?against=${first.id}&format=csv`, { token: w.tokens.viewer.secret });
    expect(link.status).toBe(200);
    const list = csvRecords(await fetchBytes(link.json.url));
    expect(list.map((r) => `${r.external_id}:${r.change}:${r.label_before}>${r.label_after}`).sort()).toEqual(
      [`${extId(1)}:relabelled:beta>alpha`, `${extId(2)}:removed:gamma>`, `${extId(26)}:added:>gamma`].sort(),
    );
    expect((await api(`${base()}/${res.json.data.id}/diff`, owner())).status).toBe(422);
  });

  it("lists editions newest first with cursor paging", async () => {
    const page1 = await api(`${base()}?limit=1`, { token: w.tokens.viewer.secret });
    expect(page1.json.data.map((e: { number: number }) => e.number)).toEqual([2]);
    expect(page1.json.data[0].rows).toBe(22);
    const page2 = await api(`${base()}?limit=1&cursor=${encodeURIComponent(page1.json.nextCursor)}`, { token: w.tokens.viewer.secret });
    expect(page2.json.data.map((e: { number: number }) => e.number)).toEqual([1]);
    expect(page2.json.nextCursor).toBeNull();
    expect((await api(`${base()}?cursor=forged.cursor`, owner())).status).toBe(400);
  });

  it("answers 404 for another project's edition, whoever asks", async () => {
    const other = `/api/v1/projects/${w.other.project.id}/editions/${first.id}`;
    expect((await api(other, { token: w.tokens.outsider.secret })).status).toBe(404);
    expect((await api(other, { token: w.tokens.admin.secret })).status).toBe(404);
    expect((await api(`${other}/download?format=csv`, { token: w.tokens.admin.secret })).status).toBe(404);
    expect((await api(`${base()}/${first.id}/download?format=csv`, { token: w.tokens.outsider.secret })).status).toBe(404);
    expect((await api(`${base()}/999999999`, owner())).status).toBe(404);
    expect((await api(`${base()}/${first.id}/download?format=xlsx`, owner())).status).toBe(422);
    expect((await api(`${base()}/${first.id}`, { method: "PATCH", ...owner(), body: {} })).status).toBe(405);
    const [pending] = await db.insert(editions).values({ projectId: w.project.id, number: 99, status: "pending", createdBy: w.users.owner.id }).returning();
    const early = await api(`${base()}/${pending.id}/download?format=csv`, owner());
    expect(early.status).toBe(409);
    expect(early.json.error.code).toBe("conflict:edition_not_ready");
    expect((await api(`${base()}/${pending.id}/diff?against=${first.id}`, owner())).status).toBe(409);
    await db.delete(editions).where(eq(editions.id, pending.id));
  });

  it("refuses DELETE to everyone but site admins; an admin's delete is audit-logged and removes the files", async () => {
    for (const role of ["owner", "reviewer", "viewer", "outsider"] as const) {
      expect((await api(`${base()}/${first.id}`, { method: "DELETE", token: w.tokens[role].secret })).status, role).toBe(403);
    }
    expect((await api(`/api/v1/projects/${w.other.project.id}/editions/${first.id}`, { method: "DELETE", token: w.tokens.admin.secret })).status).toBe(404);
    const url = (await api(`${base()}/${first.id}/download?format=csv`, owner())).json.url;
    const del = await api(`${base()}/${first.id}`, { method: "DELETE", token: w.tokens.admin.secret });
    expect(del.status).toBe(204);
    expect((await api(`${base()}/${first.id}`, owner())).status).toBe(404);
    expect((await fetch(url)).status).toBe(404);
    const audit = await db.select().from(auditLog).where(and(eq(auditLog.action, "edition.delete"), eq(auditLog.targetId, String(first.id))));
    expect(audit).toHaveLength(1);
    expect(audit[0].actorId).toBe(w.users.admin.id);
    expect((audit[0].before as { number: number }).number).toBe(1);
  });
});
