// Real uploads in the test bucket and real imports through the worker's function (no HTTP).
import fs from "node:fs";
import path from "node:path";
import { count, eq } from "drizzle-orm";
import { db } from "@/db";
import { imports, items, labelClasses, uploads } from "@/db/schema";
import { uploadKey } from "@/lib/imports/storage";
import { previewUploads } from "@/lib/imports/preview";
import { runImport } from "@/lib/imports/run";
import type { ImportFormat, RoleMapping } from "@/lib/imports/types";
import { putObject } from "@/lib/storage/s3";

export const fixture = (name: string) => path.join("tests/fixtures/imports", name);

export async function uploadFixture(projectId: number, name: string, bytes?: Uint8Array) {
  const data = bytes ?? fs.readFileSync(fixture(name));
  const fileName = path.basename(name);
  const [row] = await db.insert(uploads).values({ projectId, objectKey: "pending", fileName, size: data.length, status: "uploaded" }).returning();
  const key = uploadKey(projectId, row.id, fileName);
  await putObject(key, data);
  const [done] = await db.update(uploads).set({ objectKey: key }).where(eq(uploads.id, row.id)).returning();
  return done;
}

export async function itemCount(projectId: number) {
  const [row] = await db.select({ n: count() }).from(items).where(eq(items.projectId, projectId));
  return row.n;
}

/** Uploads fixtures, takes the detected roles unless given, runs the import and returns its final row. */
export async function importFixtures(projectId: number, names: string[], opts: { format?: ImportFormat; columns?: RoleMapping; embeddings?: string; embeddingsColumns?: RoleMapping } = {}) {
  const ups = [];
  for (const n of names) ups.push(await uploadFixture(projectId, n));
  let embeddingsUploadId: string | undefined;
  if (opts.embeddings) {
    const e = await uploadFixture(projectId, opts.embeddings);
    ups.push(e);
    embeddingsUploadId = e.id;
  }
  let format = opts.format;
  let columns = opts.columns;
  if (!format || (!columns && format !== "images")) {
    const classes = await db.select().from(labelClasses).where(eq(labelClasses.projectId, projectId));
    const p = await previewUploads({ uploads: ups, labelNames: new Set(classes.map((c) => c.name)), featureSchema: null });
    format ??= p.format;
    columns ??= p.table?.columns.map((c) => ({ name: c.name, role: c.detected, width: c.width })) ?? [];
  }
  const [imp] = await db
    .insert(imports)
    .values({ projectId, uploadIds: ups.map((u) => u.id), format, options: { columns: columns ?? [], embeddingsUploadId, embeddingsColumns: opts.embeddingsColumns } })
    .returning();
  await runImport(imp.id);
  const [done] = await db.select().from(imports).where(eq(imports.id, imp.id));
  return done;
}
