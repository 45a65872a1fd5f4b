// Shared pieces of the fault tests: generated CSV tables, uploads straight into the bucket, import polling.
import { count, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { imports, items, uploads } from "@/db/schema";
import { uploadKey } from "@/lib/imports/storage";
import { mulberry32 } from "@/lib/random";
import { putObject } from "@/lib/storage/s3";
import { sleep } from "@/tests/support/cluster";

export const COLUMNS = 8;
export const columnRoles = [{ name: "id", role: "id" as const }, ...Array.from({ length: COLUMNS }, (_, j) => ({ name: `f${j}`, role: "numeric" as const }))];

/** A CSV of `rows` rows: an id and eight numeric features (invented data; only its size and shape matter here). */
export function generatedCsv(rows: number, seed = 11): Buffer {
  const rand = mulberry32(seed);
  const lines = [["id", ...Array.from({ length: COLUMNS }, (_, j) => `f${j}`)].join(",")];
  for (let i = 0; i < rows; i += 1) {
    let line = `row-${i}`;
    for (let j = 0; j < COLUMNS; j += 1) line += `,${(rand() * 100).toFixed(3)}`;
    lines.push(line);
  }
  return Buffer.from(`${lines.join("\n")}\n`);
}

/** An upload row plus its object in the bucket, as a finished browser upload leaves them. */
export async function putUpload(projectId: number, fileName: string, data: Buffer) {
  const [row] = await db.insert(uploads).values({ projectId, objectKey: "pending", fileName, size: data.length, status: "uploaded" }).returning();
  const key = uploadKey(projectId, row.id, fileName);
  await putObject(key, data, "text/csv");
  const [done] = await db.update(uploads).set({ objectKey: key }).where(eq(uploads.id, row.id)).returning();
  return done;
}

export async function importRow(importId: string) {
  const [row] = await db.select().from(imports).where(eq(imports.id, importId));
  return row;
}

/** Polls the import row until `done` says so. */
export async function waitForImport(importId: string, done: (row: Awaited<ReturnType<typeof importRow>>) => boolean, ms = 30_000) {
  const until = Date.now() + ms;
  let row = await importRow(importId);
  while (!done(row) && Date.now() < until) {
    await sleep(50);
    row = await importRow(importId);
  }
  if (!done(row)) throw new Error(`import ${importId} stayed ${row.status} (${row.rowsDone} rows done) for ${ms} ms`);
  return row;
}

export async function itemCounts(projectId: number) {
  const [row] = await db
    .select({ n: count(), distinct: sql<number>`count(distinct ${items.externalId})::int` })
    .from(items)
    .where(eq(items.projectId, projectId));
  return { n: Number(row.n), distinct: Number(row.distinct) };
}
