import { eq, inArray } from "drizzle-orm";
import { db, pool } from "@/db";
import { imports, labelClasses, projects, uploads, type Import, type Upload } from "@/db/schema";
import { isDatabaseUnavailable, isStorageError, isStorageUnavailable } from "@/lib/errors";
import type { FeatureSchema } from "@/lib/projects/settings";
import { putObject } from "@/lib/storage/s3";
import { RowEncoder } from "./encode";
import { stageImages } from "./images";
import { ImportCancelled, ImportFailure, IssueLog } from "./issues";
import { openParquet } from "./parquet";
import { checkSchemaMatches, makePlan } from "./plan";
import { ProgressReporter } from "./progress";
import { openDelimited, openJsonLines } from "./sources";
import { ItemStager } from "./stage";
import { objectAsyncBuffer, objectChunks, objectSize } from "./storage";
import { formatBytes } from "./format-bytes";
import { limits } from "./limits";
import { importOptionsSchema, type ImportOptions, type RowSource, type StagedItem } from "./types";


export type ImportContext = {
  imp: Import;
  uploads: Upload[];
  options: ImportOptions;
  schema: FeatureSchema | null;
  missing: "reject" | "missing";
  classes: Map<string, number>;
  issues: IssueLog;
  progress: ProgressReporter;
};

export type StagedStream = { featureSchema: FeatureSchema; categories?: Map<string, Set<string>>; items: AsyncIterable<StagedItem> };

async function openTable(ctx: ImportContext): Promise<RowSource> {
  const up = ctx.uploads[0];
  if (ctx.imp.format === "parquet") return openParquet(await objectAsyncBuffer(up.objectKey));
  const chunks = await objectChunks(up.objectKey);
  if (ctx.imp.format === "jsonl") return openJsonLines(chunks, { columns: ctx.options.columns.map((c) => c.name) });
  return openDelimited(chunks, { delimiter: ctx.options.delimiter });
}

/** Streams a table upload through the plan and the encoder. */
async function stageTable(ctx: ImportContext): Promise<StagedStream> {
  const source = await openTable(ctx);
  const plan = makePlan(source.columns, ctx.options.columns, "table");
  checkSchemaMatches(ctx.schema, plan.featureSchema);
  const encoder = new RowEncoder(plan, { missing: ctx.missing, classes: ctx.classes, headerWidth: source.columns.length, ragged: ctx.imp.format === "csv" });
  const size = ctx.uploads[0].size;
  async function* items(): AsyncGenerator<StagedItem> {
    let done = 0;
    for await (const batch of source.rows) {
      for (const r of batch) {
        const item = encoder.encode(r, ctx.issues);
        if (item) yield item;
      }
      done += batch.length;
      const read = source.bytesRead();
      const total = source.total ?? (read > 0 ? Math.max(done, (done * size) / read) : null);
      if (await ctx.progress.tick(done, total)) throw new ImportCancelled();
    }
    await ctx.progress.tick(done, done, true);
    if (done === 0) ctx.issues.add({ row: null, column: null, message: "The file has a header but no rows." });
  }
  return { featureSchema: plan.featureSchema, categories: encoder.categories, items: items() };
}

function mergeCategories(schema: FeatureSchema, categories: Map<string, Set<string>> | undefined, previous: FeatureSchema | null): FeatureSchema {
  return {
    ...schema,
    columns: schema.columns.map((c) => {
      if (c.kind !== "categorical") return c;
      const seen = new Set([...(previous?.columns.find((p) => p.name === c.name)?.categories ?? []), ...(categories?.get(c.name) ?? [])]);
      return { ...c, categories: [...seen].sort() };
    }),
  };
}

const unreachable = "The object store could not be reached while reading the file; nothing was imported. Start the import again once it is back.";

/** Every upload must still be in the bucket, within the size limit. */
async function checkUploads(ctx: ImportContext) {
  if (ctx.uploads.length !== ctx.imp.uploadIds.length) throw new ImportFailure("An uploaded file of this import no longer exists; upload it again.");
  for (const up of ctx.uploads) {
    const size = await objectSize(up.objectKey).catch((error: unknown) => {
      if (isStorageUnavailable(error)) throw new ImportFailure(unreachable);
      return -1;
    });
    if (size < 0) throw new ImportFailure(`\`${up.fileName}\` is not in the bucket; upload it again.`);
    if (size > limits.uploadMaxBytes) throw new ImportFailure(`\`${up.fileName}\` is ${formatBytes(size)}; the limit per file is ${formatBytes(limits.uploadMaxBytes)}.`);
    if (size === 0) throw new ImportFailure(`\`${up.fileName}\` is empty (0 bytes): there is no header and no rows.`);
  }
}

async function loadContext(importId: string): Promise<ImportContext | null> {
  const [imp] = await db.select().from(imports).where(eq(imports.id, importId)).limit(1);
  if (!imp || imp.status === "succeeded" || imp.status === "cancelled" || imp.status === "failed") return null;
  const [project] = await db.select().from(projects).where(eq(projects.id, imp.projectId)).limit(1);
  if (!project) return null;
  const ups = await db.select().from(uploads).where(inArray(uploads.id, imp.uploadIds));
  const ordered = imp.uploadIds.map((id) => ups.find((u) => u.id === id)).filter((u): u is Upload => Boolean(u));
  const classes = await db.select({ id: labelClasses.id, name: labelClasses.name }).from(labelClasses).where(eq(labelClasses.projectId, project.id));
  await db.update(imports).set({ status: "running", startedAt: new Date(), rowsDone: 0, errorCount: 0, errors: [], message: null }).where(eq(imports.id, importId));
  return {
    imp,
    uploads: ordered,
    options: importOptionsSchema.parse(imp.options),
    schema: project.featureSchema ?? null,
    missing: project.settings.missingValues,
    classes: new Map(classes.map((c) => [c.name, c.id])),
    issues: new IssueLog(),
    progress: new ProgressReporter(importId),
  };
}

async function finishFailed(ctx: ImportContext, message: string) {
  const key = `projects/${ctx.imp.projectId}/imports/${ctx.imp.id}/errors.csv`;
  let reportKey: string | null = null;
  if (ctx.issues.count > 0) {
    // The failure is recorded even when the report cannot be written (e.g. the object store is down).
    try {
      await putObject(key, ctx.issues.toCsv(), "text/csv; charset=utf-8");
      reportKey = key;
    } catch (error) {
      if (!isStorageUnavailable(error) && !isStorageError(error)) throw error;
    }
  }
  await db
    .update(imports)
    .set({ status: "failed", errorCount: ctx.issues.count, errors: ctx.issues.first, errorReportKey: reportKey, message, itemsCreated: 0, itemsSkipped: 0, finishedAt: new Date() })
    .where(eq(imports.id, ctx.imp.id));
}

/** The import job: validates every row, and stores all of the file's items or none. Safe to re-run. */
export async function runImport(importId: string, hooks: { phase?: (name: string) => void } = {}): Promise<void> {
  const phase = hooks.phase ?? (() => undefined);
  const ctx = await loadContext(importId);
  if (!ctx) return;
  const client = await pool.connect();
  let release: boolean | Error = false;
  let stager: ItemStager | null = null;
  try {
    await checkUploads(ctx);
    const staged = ctx.imp.format === "images" ? await stageImages(ctx) : await stageTable(ctx);
    stager = await ItemStager.begin(client, ctx.imp.projectId, ctx.imp.id);
    for await (const item of staged.items) {
      if (ctx.issues.count === 0) await stager.write(item);
      if (ctx.issues.full) break;
    }
    if (ctx.issues.count > 0) {
      release = new Error("rolled back");
      await stager.rollback();
      await finishFailed(ctx, `${ctx.issues.count} problem${ctx.issues.count === 1 ? "" : "s"} found; nothing was imported.${ctx.issues.full ? " Checking stopped at the report's limit." : ""}`);
      return;
    }
    phase("staged");
    const { created, staged: total } = await stager.finish();
    phase("inserted");
    const featureSchema = mergeCategories(staged.featureSchema, staged.categories, ctx.schema);
    await client.query("UPDATE projects SET feature_schema = $2, updated_at = now() WHERE id = $1", [ctx.imp.projectId, JSON.stringify(featureSchema)]);
    await client.query(
      `UPDATE imports SET status = 'succeeded', rows_done = $2, rows_total = $2, items_created = $3, items_skipped = $4, error_count = 0,
        errors = '[]'::jsonb, finished_at = now(), message = $5 WHERE id = $1`,
      [ctx.imp.id, total, created, total - created, `${created} new item${created === 1 ? "" : "s"}; ${total - created} already present.`],
    );
    await client.query(
      "INSERT INTO audit_log (actor_id, project_id, action, target_type, target_id, after) VALUES ($1, $2, 'import.succeeded', 'import', $3, $4)",
      [ctx.imp.createdBy, ctx.imp.projectId, ctx.imp.id, JSON.stringify({ format: ctx.imp.format, created, skipped: total - created })],
    );
    await client.query("COMMIT");
    phase("committed");
  } catch (error) {
    release = error instanceof Error ? error : new Error(String(error));
    if (stager) await stager.rollback();
    if (error instanceof ImportCancelled) {
          await db.update(imports).set({ status: "cancelled", message: "Cancelled; nothing was imported.", finishedAt: new Date() }).where(eq(imports.id, importId));
      return;
    }
    if (error instanceof ImportFailure) {
      ctx.issues.add({ row: null, column: error.column, message: error.message });
      await finishFailed(ctx, error.message);
      return;
    }
    if (isDatabaseUnavailable(error)) throw error;
    if (isStorageUnavailable(error)) {
      await finishFailed(ctx, unreachable).catch(() => undefined);
      return;
    }
    console.error("[import]", importId, error);
    await finishFailed(ctx, `The import stopped on an unexpected error (${(error as Error).message}); nothing was imported.`).catch(() => undefined);
  } finally {
    client.release(release === false ? undefined : true);
  }
}
