// Shared helpers for the hostile-input corpus: real HTTP against the app, real worker, real PostgreSQL.
import fs from "node:fs";
import path from "node:path";
import { count, eq } from "drizzle-orm";
import { expect } from "vitest";
import { db, pool } from "@/db";
import { items } from "@/db/schema";
import { api } from "@/tests/support/http";

export const hostileFixture = (name: string) => fs.readFileSync(path.join("tests/fixtures/hostile", name));
export const importFixture = (name: string) => fs.readFileSync(path.join("tests/fixtures/imports", name));

export const sqlPayloads = ["'; drop table items; --", "1 or 1=1", "Robert'); DROP TABLE labels;--"] as const;
export const scriptPayloads = ["<script>window.__pwned=1</script>", '"><img src=x onerror=window.__pwned=1>'] as const;
export const payloads = [...sqlPayloads, ...scriptPayloads] as const;

export type Reply = Awaited<ReturnType<typeof api>>;

/** Every hostile answer: never a 5xx, and a 4xx carries a stable `kind:subject` code and a message. */
export function expectClean(res: Reply, label: string) {
  expect(res.status, `${label}: ${res.text.slice(0, 300)}`).toBeLessThan(500);
  if (res.status >= 400) {
    expect(res.json?.error?.code, `${label}: ${res.text.slice(0, 300)}`).toMatch(/^[a-z_]+:[a-z_]+$/);
    expect(String(res.json?.error?.message ?? "").length, label).toBeGreaterThan(5);
  }
}

export async function itemCount(projectId: number) {
  const [row] = await db.select({ n: count() }).from(items).where(eq(items.projectId, projectId));
  return row.n;
}

/** The tables SQL-looking strings name are still there. */
export async function tablesIntact() {
  const r = await pool.query("SELECT to_regclass('public.items') AS items, to_regclass('public.labels') AS labels, to_regclass('public.projects') AS projects, to_regclass('public.users') AS users");
  expect(r.rows[0]).toEqual({ items: "items", labels: "labels", projects: "projects", users: "users" });
}

/** Registers, PUTs (presigned) and completes one upload; returns its id, or the failing answer. */
export async function uploadBytes(projectId: number, token: string, fileName: string, bytes: Uint8Array, contentType = "application/octet-stream") {
  const base = `/api/v1/projects/${projectId}`;
  const start = await api(`${base}/uploads`, { token, body: { fileName, size: bytes.length, contentType } });
  expectClean(start, `upload ${fileName}`);
  if (start.status !== 201) return { start } as const;
  expect(start.json.mode).toBe("single");
  const put = await fetch(start.json.url, { method: "PUT", body: bytes as unknown as BodyInit, headers: { "content-type": contentType } });
  expect(put.status).toBe(200);
  const done = await api(`${base}/uploads/${start.json.upload.id}/complete`, { token, body: {} });
  return { start, done, id: start.json.upload.id as string } as const;
}

/** Starts an import over HTTP and waits for the worker to settle it. */
export async function importAndWait(projectId: number, token: string, body: Record<string, unknown>) {
  const base = `/api/v1/projects/${projectId}`;
  const started = await api(`${base}/imports`, { token, body });
  expectClean(started, "start import");
  if (started.status !== 202) return { started, final: null };
  for (let i = 0; i < 160; i += 1) {
    const r = await api(`${base}/imports/${started.json.import.id}`, { token });
    expectClean(r, "import status");
    if (!["pending", "running"].includes(r.json.import.status)) return { started, final: r.json.import as { status: string; message: string | null; itemsCreated: number; errors?: unknown } };
    await new Promise((res) => setTimeout(res, 250));
  }
  throw new Error("the import did not settle within 40 s (is the worker running?)");
}

/** A JSON value nested `depth` levels deep, built as text (JSON.stringify would recurse). */
export function deepJson(depth: number, kind: "array" | "object" = "array") {
  return kind === "array" ? `${"[".repeat(depth)}1${"]".repeat(depth)}` : `${'{"a":'.repeat(depth)}1${"}".repeat(depth)}`;
}
