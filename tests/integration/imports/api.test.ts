// The HTTP surface against the running app and worker: roles, presigned uploads (single and multipart), preview, import, items.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type PgBoss from "pg-boss";
import { createWorkerBoss } from "@/lib/jobs/boss";
import { handleImport } from "@/worker/jobs/import";
import { api } from "@/tests/support/http";
import { makeProject, makeRoleWorld } from "@/tests/support/fixtures";
import fs from "node:fs";
import { fixture } from "./helpers";

type World = Awaited<ReturnType<typeof makeRoleWorld>>;
let w: World;
let projectId = 0;
const base = () => `/api/v1/projects/${projectId || w.project.id}`;

async function upload(token: string, name: string, bytes: Uint8Array) {
  const start = await api(`${base()}/uploads`, { token, body: { fileName: name, size: bytes.length, contentType: "text/csv" } });
  expect(start.status).toBe(201);
  if (start.json.mode === "single") {
    const put = await fetch(start.json.url, { method: "PUT", body: bytes as unknown as BodyInit, headers: { "content-type": "text/csv" } });
    expect(put.status).toBe(200);
    const done = await api(`${base()}/uploads/${start.json.upload.id}/complete`, { token, body: {} });
    expect(done.status).toBe(200);
    return start.json.upload.id as string;
  }
  const parts = [];
  for (const p of start.json.parts as Array<{ partNumber: number; url: string }>) {
    const body = bytes.subarray((p.partNumber - 1) * start.json.partSize, p.partNumber * start.json.partSize);
    const put = await fetch(p.url, { method: "PUT", body: body as unknown as BodyInit });
    expect(put.status).toBe(200);
    parts.push({ partNumber: p.partNumber, etag: put.headers.get("etag")! });
  }
  const done = await api(`${base()}/uploads/${start.json.upload.id}/complete`, { token, body: { multipartId: start.json.multipartId, parts } });
  expect(done.status, done.text).toBe(200);
  return start.json.upload.id as string;
}

async function waitFor(token: string, importId: string) {
  for (let i = 0; i < 60; i += 1) {
    const r = await api(`${base()}/imports/${importId}`, { token });
    if (!["pending", "running"].includes(r.json.import.status)) return r.json.import;
    await new Promise((res) => setTimeout(res, 250));
  }
  throw new Error("the import did not finish within 15 s (is the import job registered in worker/registry.ts?)");
}

// This file consumes the `import` queue itself (as worker/index.ts does once the job is registered),
// so it does not depend on how the worker process is wired.
let boss: PgBoss;
beforeAll(async () => {
  w = await makeRoleWorld();
  boss = await createWorkerBoss();
  await boss.work("import", { batchSize: 1, pollingIntervalSeconds: 0.5 }, async (jobs) => {
    for (const job of jobs) await handleImport(job.data as { importId: string });
  });
});
afterAll(async () => {
  await boss.stop({ graceful: true, timeout: 5_000 });
});

describe("uploads", () => {
  it("gates by role: owners only, outsiders see nothing", async () => {
    const body = { fileName: "a.csv", size: 10 };
    expect((await api(`${base()}/uploads`, { token: w.tokens.viewer.secret, body })).status).toBe(403);
    expect((await api(`${base()}/uploads`, { token: w.tokens.annotator.secret, body })).status).toBe(403);
    expect((await api(`${base()}/uploads`, { token: w.tokens.outsider.secret, body })).status).toBe(404);
    expect((await api(`${base()}/uploads`, { body })).status).toBe(401);
    expect((await api(`${base()}/uploads`, { token: w.tokens.owner.secret, body: { fileName: "", size: 1 } })).status).toBe(422);
  });

  it("refuses a file over the size limit and an empty file", async () => {
    const big = await api(`${base()}/uploads`, { token: w.tokens.owner.secret, body: { fileName: "huge.csv", size: 3 * 1024 ** 3 } });
    expect(big.status).toBe(413);
    expect(big.json.error.message).toMatch(/the limit per file is/);
    expect((await api(`${base()}/uploads`, { token: w.tokens.owner.secret, body: { fileName: "none.csv", size: 0 } })).status).toBe(400);
  });

  it("takes a large file in parts through presigned URLs", async () => {
    const size = 17 * 1024 * 1024 + 123;
    const bytes = new Uint8Array(size).map((_, i) => 48 + (i % 10));
    const id = await upload(w.tokens.owner.secret, "large.bin", bytes);
    expect(id).toMatch(/^[0-9a-f-]{36}$/);
  });
});

describe("import over HTTP", () => {
  let importId = "";
  it("previews, imports with the confirmed roles, and pages the items", async () => {
    const uploadId = await upload(w.tokens.owner.secret, "samples.csv", fs.readFileSync(fixture("samples.csv")));
    const preview = await api(`${base()}/imports/preview`, { token: w.tokens.owner.secret, body: { uploadIds: [uploadId] } });
    expect(preview.status).toBe(200);
    expect(preview.json.preview.format).toBe("csv");
    const columns = preview.json.preview.table.columns.map((c: { name: string; detected: string }) => ({ name: c.name, role: c.detected }));
    expect(columns.map((c: { role: string }) => c.role)).toEqual(["id", "numeric", "numeric", "categorical", "text", "prior_label"]);
    const started = await api(`${base()}/imports`, { token: w.tokens.owner.secret, body: { uploadIds: [uploadId], format: "csv", columns } });
    expect(started.status).toBe(202);
    importId = started.json.import.id;
    const done = await waitFor(w.tokens.owner.secret, importId);
    expect(done.status).toBe("succeeded");
    expect(done.itemsCreated).toBe(6);

    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const page: { status: number; json: { items: Array<{ externalId: string }>; nextCursor: string | null } } = await api(`${base()}/items?limit=4${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ""}`, { token: w.tokens.viewer.secret });
      expect(page.status).toBe(200);
      seen.push(...page.json.items.map((i) => i.externalId));
      cursor = page.json.nextCursor;
    } while (cursor);
    expect(seen).toEqual(["s-001", "s-002", "s-003", "s-004", "s-005", "s-006"]);
    const desc = await api(`${base()}/items?sort=external_id&dir=desc&q=00&limit=2`, { token: w.tokens.viewer.secret });
    expect(desc.json.items.map((i: { externalId: string }) => i.externalId)).toEqual(["s-006", "s-005"]);
    expect(desc.json.total).toBe(6);
    const tampered = await api(`${base()}/items?cursor=abc.def`, { token: w.tokens.viewer.secret });
    expect(tampered.status).toBe(400);

    const detail = await api(`${base()}/items/${desc.json.items[0].id}`, { token: w.tokens.viewer.secret });
    expect(detail.status).toBe(200);
    expect(detail.json.item.fields).toEqual({ site: "east", note: 'said "ok"' });
    expect(detail.json.item.features).toEqual([{ name: "depth_m", kind: "numeric", value: Math.fround(9.4) }, { name: "salinity", kind: "numeric", value: Math.fround(34.2) }]);
    expect((await api(`${base()}/items/999999999`, { token: w.tokens.viewer.secret })).status).toBe(404);
    expect((await api(`${base()}/items`, { token: w.tokens.outsider.secret })).status).toBe(404);
  });

  it("offers the error report of a failed import as a CSV download", async () => {
    // A project of its own: the first project's feature schema would reject this file before its rows.
    projectId = (await makeProject({ members: [{ userId: w.users.owner.id, role: "owner" }] })).project.id;
    const uploadId = await upload(w.tokens.owner.secret, "dups.csv", fs.readFileSync(fixture("malformed/duplicate-ids.csv")));
    const started = await api(`${base()}/imports`, { token: w.tokens.owner.secret, body: { uploadIds: [uploadId], format: "csv", columns: [{ name: "id", role: "id" }, { name: "depth_m", role: "numeric" }] } });
    const done = await waitFor(w.tokens.owner.secret, started.json.import.id);
    expect(done.status).toBe("failed");
    const link = await api(`${base()}/imports/${done.id}/errors?format=json`, { token: w.tokens.owner.secret });
    const csv = await (await fetch(link.json.url)).text();
    expect(csv).toContain("3,id,the id 'd-1' also appears on row 1");
    expect((await api(`${base()}/imports/${done.id}/cancel`, { token: w.tokens.owner.secret, method: "POST" })).status).toBe(409);
    projectId = 0;
  });
});

describe("POST items (pipelines)", () => {
  it("takes a JSON batch, is idempotent, and accepts NDJSON", async () => {
    const items = [
      { id: "api-1", depth_m: 1, salinity: 30, site: "north", note: "from a pipeline" },
      { id: "api-2", depth_m: 2, salinity: 31, site: "south", note: "x", priorLabel: "gamma" },
    ];
    const first = await api(`${base()}/items`, { token: w.tokens.owner.secret, body: { items } });
    expect(first.status, first.text).toBe(201);
    expect(first.json).toMatchObject({ received: 2, created: 2, skipped: 0 });
    const again = await api(`${base()}/items`, { token: w.tokens.owner.secret, body: items });
    expect(again.json).toMatchObject({ created: 0, skipped: 2 });
    const nd = await api(`${base()}/items`, { token: w.tokens.owner.secret, raw: `${JSON.stringify({ id: "api-3", depth_m: 3, salinity: 1, site: "east" })}\n`, headers: { "content-type": "application/x-ndjson" } });
    expect(nd.json).toMatchObject({ created: 1 });
  });

  it("rejects a bad batch whole, with row reasons, and checks the role and the size", async () => {
    const bad = await api(`${base()}/items`, { token: w.tokens.owner.secret, body: [{ id: "bad-1", depth_m: 1, salinity: 1, site: "x" }, { id: "bad-2", depth_m: "n/a", salinity: 1, site: "x" }] });
    expect(bad.status).toBe(400);
    expect(bad.json.error.details.errors[0].description).toBe("row 2, column `depth_m`: 'n/a' is not a number");
    const list = await api(`${base()}/items?q=bad-`, { token: w.tokens.viewer.secret });
    expect(list.json.total).toBe(0);
    expect((await api(`${base()}/items`, { token: w.tokens.viewer.secret, body: [{ id: "v" }] })).status).toBe(403);
    const many = Array.from({ length: 10_001 }, (_, i) => ({ id: `m-${i}`, depth_m: 1, salinity: 1, site: "x" }));
    expect((await api(`${base()}/items`, { token: w.tokens.owner.secret, body: many })).status).toBe(413);
  });
});
