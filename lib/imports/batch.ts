import { eq } from "drizzle-orm";
import { db, pool } from "@/db";
import { imports, labelClasses, projects } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { detectColumns } from "./detect";
import { RowEncoder } from "./encode";
import { describe, ImportFailure, IssueLog } from "./issues";
import { limits } from "./limits";
import { checkSchemaMatches, makePlan } from "./plan";
import { ArrayRow } from "./row-values";
import { ItemStager } from "./stage";
import type { RoleMapping, StagedItem } from "./types";
import { roleMappingSchema } from "./types";

const idKeys = new Set(["id", "externalId", "external_id"]);
const priorKeys = new Set(["priorLabel", "prior_label"]);

/** Reads a JSON body (an array, or { items, columns }) or NDJSON (one item per line). */
export function parseBatchBody(text: string, contentType: string): { items: Record<string, unknown>[]; columns?: RoleMapping } {
  const fail = (m: string) => new AppError("bad_request:json", m);
  let items: unknown[];
  let columns: RoleMapping | undefined;
  if (/ndjson|jsonl|json-seq/i.test(contentType)) {
    items = [];
    text.split("\n").forEach((line, i) => {
      if (!line.trim()) return;
      try {
        items.push(JSON.parse(line));
      } catch {
        throw fail(`Line ${i + 1} is not valid JSON.`);
      }
    });
  } else {
    let body: unknown;
    try {
      body = JSON.parse(text);
    } catch {
      throw fail("The request body is not valid JSON.");
    }
    if (Array.isArray(body)) items = body;
    else if (body && typeof body === "object" && Array.isArray((body as { items?: unknown }).items)) {
      items = (body as { items: unknown[] }).items;
      const cols = (body as { columns?: unknown }).columns;
      if (cols !== undefined) columns = roleMappingSchema.parse(cols);
    } else throw fail("Send an array of items, an object { items: [...] }, or NDJSON.");
  }
  if (items.length === 0) throw new AppError("bad_request:items", "The batch holds no items.");
  if (items.length > limits.batchMaxItems) throw new AppError("too_large:batch", `The batch holds ${items.length} items; the limit is ${limits.batchMaxItems} per request.`);
  items.forEach((it, i) => {
    if (!it || typeof it !== "object" || Array.isArray(it)) throw new AppError("bad_request:items", `Item ${i + 1} is not a JSON object.`);
  });
  return { items: items as Record<string, unknown>[], columns };
}

/** Roles for a batch: explicit columns win, then the project's feature schema, then detection. */
function rolesFor(keys: string[], rows: ArrayRow[], given: RoleMapping | undefined, schema: typeof projects.$inferSelect.featureSchema, labelNames: Set<string>): RoleMapping {
  if (given) return given;
  const detected = detectColumns(keys, rows, labelNames);
  return detected.map((d) => {
    const known = schema?.columns.find((c) => c.name === d.name);
    if (idKeys.has(d.name)) return { name: d.name, role: "id" };
    if (priorKeys.has(d.name)) return { name: d.name, role: "prior_label" };
    if (known) return { name: d.name, role: known.kind, width: known.kind === "vector" ? known.width : undefined };
    if (schema) return { name: d.name, role: d.detected === "prior_label" ? "prior_label" : "text" };
    return { name: d.name, role: d.detected === "id" && !keys.some((k) => idKeys.has(k)) ? "id" : d.detected, width: d.width };
  });
}

/** The REST path for pipelines: the same validation, idempotency and all-or-nothing write as file imports. */
export async function importBatch({ projectId, userId, items: records, columns }: { projectId: number; userId: string; items: Record<string, unknown>[]; columns?: RoleMapping }) {
  const [project] = await db.select().from(projects).where(eq(projects.id, projectId)).limit(1);
  if (!project) throw new AppError("not_found:project", "No such project.");
  const classes = await db.select({ id: labelClasses.id, name: labelClasses.name }).from(labelClasses).where(eq(labelClasses.projectId, projectId));
  const keys = [...new Set(records.flatMap((r) => Object.keys(r)))];
  const rows = records.map((r) => new ArrayRow(keys.map((k) => r[k])));
  const issues = new IssueLog();
  let staged: StagedItem[];
  let plan;
  try {
    const mapping = rolesFor(keys, rows, columns, project.featureSchema, new Set(classes.map((c) => c.name)));
    plan = makePlan(keys, mapping, project.featureSchema?.source === "embedding" ? "embedding" : "table");
    if (!plan.id) throw new ImportFailure("Each item needs an `id` (its external id), so that sending it again does not duplicate it.");
    checkSchemaMatches(project.featureSchema, plan.featureSchema);
    const encoder = new RowEncoder(plan, { missing: project.settings.missingValues, classes: new Map(classes.map((c) => [c.name, c.id])), headerWidth: keys.length, ragged: false });
    staged = [];
    rows.forEach((values, i) => {
      const item = encoder.encode({ row: i + 1, values }, issues);
      if (item) staged.push({ ...item, vector: item.vector ? Float32Array.from(item.vector) : null });
    });
  } catch (error) {
    if (error instanceof ImportFailure) throw new AppError("bad_request:items", error.message);
    throw error;
  }
  if (issues.count > 0) {
    throw new AppError("bad_request:items", `${issues.count} problem${issues.count === 1 ? "" : "s"} in the batch (item numbers count from 1); nothing was stored. First: ${describe(issues.first[0])}`, {
      errorCount: issues.count,
      errors: issues.first.map((e) => ({ ...e, item: e.row, description: describe(e) })),
    });
  }
  const [imp] = await db.insert(imports).values({ projectId, uploadIds: [], format: "api", options: { columns: plan.columns.map((c) => ({ name: c.name, role: c.role, width: c.width || undefined })) }, status: "running", rowsTotal: staged.length, createdBy: userId, startedAt: new Date() }).returning();
  const client = await pool.connect();
  let broken = false;
  try {
    const stager = await ItemStager.begin(client, projectId, imp.id);
    for (const item of staged) await stager.write(item);
    const { created } = await stager.finish();
    if (!project.featureSchema) await client.query("UPDATE projects SET feature_schema = $2, updated_at = now() WHERE id = $1 AND feature_schema IS NULL", [projectId, JSON.stringify(plan.featureSchema)]);
    await client.query("UPDATE imports SET status = 'succeeded', rows_done = $2, items_created = $3, items_skipped = $4, finished_at = now() WHERE id = $1", [imp.id, staged.length, created, staged.length - created]);
    await client.query("COMMIT");
    return { importId: imp.id, received: staged.length, created, skipped: staged.length - created };
  } catch (error) {
    broken = true;
    await client.query("ROLLBACK").catch(() => undefined);
    await db.update(imports).set({ status: "failed", message: (error as Error).message, finishedAt: new Date() }).where(eq(imports.id, imp.id));
    throw error;
  } finally {
    client.release(broken ? true : undefined);
  }
}
