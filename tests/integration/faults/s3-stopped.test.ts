// The fake S3 server stopped during an upload and during an import: clear errors, nothing half-imported, then restarted.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, expect, it } from "vitest";
import { db } from "@/db";
import { items } from "@/db/schema";
import { api } from "@/tests/support/http";
import { makeRoleWorld } from "@/tests/support/fixtures";
import { portOpen, s3Port, startS3, stopS3 } from "@/tests/support/cluster";
import { columnRoles, generatedCsv, itemCounts, putUpload, waitForImport } from "./helpers";

let w: Awaited<ReturnType<typeof makeRoleWorld>>;
const base = () => `/api/v1/projects/${w.project.id}`;

beforeAll(async () => {
  w = await makeRoleWorld();
});

afterAll(async () => {
  if (!(await portOpen(s3Port))) await startS3();
});

it("refuses to complete an upload whose bytes never reached the stopped store, with a clear 409", async () => {
  const bytes = generatedCsv(50);
  const start = await api(`${base()}/uploads`, { token: w.tokens.owner.secret, body: { fileName: "during-outage.csv", size: bytes.length, contentType: "text/csv" } });
  expect(start.status).toBe(201);
  expect(start.json.mode).toBe("single");
  await stopS3();
  try {
    const put = await fetch(start.json.url, { method: "PUT", body: new Uint8Array(bytes), headers: { "content-type": "text/csv" } }).then(
      (r) => r.status,
      (e: Error) => e.message,
    );
    expect(put, "the browser's PUT cannot reach the store").toBe("fetch failed");
    const done = await api(`${base()}/uploads/${start.json.upload.id}/complete`, { token: w.tokens.owner.secret, body: {} });
    expect(done.status, done.text).toBe(409);
    expect(done.json.error.code).toBe("conflict:upload");
    expect(done.json.error.message).toMatch(/during-outage\.csv.*upload it again/);
  } finally {
    await startS3();
  }
  // With the store back, the same upload goes through.
  const retry = await api(`${base()}/uploads`, { token: w.tokens.owner.secret, body: { fileName: "after-outage.csv", size: bytes.length, contentType: "text/csv" } });
  expect((await fetch(retry.json.url, { method: "PUT", body: new Uint8Array(bytes), headers: { "content-type": "text/csv" } })).status).toBe(200);
  expect((await api(`${base()}/uploads/${retry.json.upload.id}/complete`, { token: w.tokens.owner.secret, body: {} })).status).toBe(200);
}, 60_000);

it("fails an import whose file stream is cut by the store stopping, with zero items, and imports it once the store is back", async () => {
  // Large enough that the worker is still streaming when the store stops (about 30 MB).
  const rows = 400_000;
  const upload = await putUpload(w.project.id, "big.csv", generatedCsv(rows));
  const started = await api(`${base()}/imports`, { token: w.tokens.owner.secret, body: { uploadIds: [upload.id], format: "csv", columns: columnRoles } });
  expect(started.status, started.text).toBe(202);
  const importId = started.json.import.id as string;
  const running = await waitForImport(importId, (r) => r.status !== "pending" && (r.rowsDone > 0 || r.status !== "running"));
  expect(running.status, "the store must stop while the import runs").toBe("running");
  await stopS3();
  let failed;
  try {
    // A cut stream (ECONNRESET) is retried by the queue like a database outage; each retry then finds the store down.
    // The store stays down until the import has ended, so it cannot succeed with a partial file.
    failed = await waitForImport(importId, (r) => !["pending", "running"].includes(r.status), 75_000);
  } finally {
    await startS3();
  }
  console.log(`[faults] import cut at ${running.rowsDone} of ${rows} rows: ${failed.status}: ${failed.message}`);
  expect(failed.status).toBe("failed");
  expect(failed.message).toMatch(/nothing was imported|big\.csv/);
  expect(failed.itemsCreated).toBe(0);
  expect((await db.select({ id: items.id }).from(items).where(eq(items.importId, importId))).length).toBe(0);
  expect(await itemCounts(w.project.id)).toEqual({ n: 0, distinct: 0 });

  const again = await api(`${base()}/imports`, { token: w.tokens.owner.secret, body: { uploadIds: [upload.id], format: "csv", columns: columnRoles } });
  const done = await waitForImport(again.json.import.id, (r) => !["pending", "running"].includes(r.status), 45_000);
  expect(done.status, done.message ?? "").toBe("succeeded");
  expect(await itemCounts(w.project.id)).toEqual({ n: rows, distinct: rows });
}, 150_000);
