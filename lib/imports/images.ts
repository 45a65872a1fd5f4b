import { createHash } from "node:crypto";
import { getObjectBytes, putObject } from "@/lib/storage/s3";
import type { FeatureSchema } from "@/lib/projects/settings";
import { RowEncoder } from "./encode";
import { ImportCancelled, ImportFailure } from "./issues";
import { limits } from "./limits";
import { checkSchemaMatches, makePlan } from "./plan";
import { decodeImage, pixelVectorName, pixelVectorWidth } from "./pixels";
import type { ImportContext, StagedStream } from "./run";
import { openDelimited, openJsonLines } from "./sources";
import { objectChunks } from "./storage";
import { isZip, unzipSafely, type ZipEntry } from "./zip";
import type { StagedItem } from "./types";

const contentTypes: Record<string, string> = { png: "image/png", jpeg: "image/jpeg", webp: "image/webp" };

export function isTableName(name: string) {
  return /\.(csv|tsv|txt|jsonl|ndjson)$/i.test(name);
}

/** Reads an embeddings table keyed by file name into a map; problems are reported against its rows. */
async function loadEmbeddings(ctx: ImportContext): Promise<{ vectors: Map<string, Float32Array>; schema: FeatureSchema } | null> {
  const id = ctx.options.embeddingsUploadId;
  if (!id) return null;
  const up = ctx.uploads.find((u) => u.id === id);
  if (!up) throw new ImportFailure("The embeddings file is not among this import's uploads.");
  const mapping = ctx.options.embeddingsColumns ?? [];
  const chunks = await objectChunks(up.objectKey);
  const source = /\.(jsonl|ndjson)$/i.test(up.fileName) ? await openJsonLines(chunks, { columns: mapping.map((m) => m.name) }) : await openDelimited(chunks);
  const plan = makePlan(source.columns, mapping, "embedding");
  if (!plan.id) throw new ImportFailure(`Mark the column of \`${up.fileName}\` that holds the image file names as the id.`);
  if (plan.categorical.length) throw new ImportFailure("An embeddings file takes numeric or vector columns only.");
  const encoder = new RowEncoder(plan, { missing: ctx.missing, classes: ctx.classes, headerWidth: source.columns.length, ragged: !/\.(jsonl|ndjson)$/i.test(up.fileName) });
  const vectors = new Map<string, Float32Array>();
  for await (const batch of source.rows) {
    for (const r of batch) {
      const item = encoder.encode(r, ctx.issues);
      if (item?.vector) vectors.set(item.externalId, Float32Array.from(item.vector));
    }
  }
  return { vectors, schema: plan.featureSchema };
}

async function listEntries(ctx: ImportContext): Promise<ZipEntry[]> {
  const entries: ZipEntry[] = [];
  let total = 0;
  for (const up of ctx.uploads) {
    if (up.id === ctx.options.embeddingsUploadId) continue;
    const bytes = await getObjectBytes(up.objectKey);
    if (isZip(bytes)) entries.push(...unzipSafely(bytes, up.fileName));
    else entries.push({ name: up.fileName, bytes });
    total = entries.length;
  }
  if (total === 0) throw new ImportFailure("There are no images to import.");
  return entries;
}

function embeddingFor(vectors: Map<string, Float32Array>, name: string) {
  return vectors.get(name) ?? vectors.get(name.split("/").pop() ?? name) ?? vectors.get((name.split("/").pop() ?? name).replace(/\.[^.]+$/, ""));
}

/** Image imports: each file (or zip entry) becomes an item with a thumbnail and a vector (pixels or the embeddings file). */
export async function stageImages(ctx: ImportContext): Promise<StagedStream> {
  const embeddings = await loadEmbeddings(ctx);
  const featureSchema: FeatureSchema = embeddings?.schema ?? { columns: [{ name: pixelVectorName, kind: "vector", width: pixelVectorWidth }], dimension: pixelVectorWidth, source: "image" };
  checkSchemaMatches(ctx.schema, featureSchema);
  const entries = await listEntries(ctx);
  if (entries.length > limits.zipMaxEntries) throw new ImportFailure(`${entries.length} images is over the limit of ${limits.zipMaxEntries} per import.`);
  const projectId = ctx.imp.projectId;
  async function* items(): AsyncGenerator<StagedItem> {
    const seen = new Map<string, number>();
    for (let i = 0; i < entries.length; i += 1) {
      const { name, bytes } = entries[i];
      const row = i + 1;
      const first = seen.get(name);
      if (first !== undefined) {
        ctx.issues.add({ row, column: null, message: `the file name \`${name}\` appears twice (also image ${first})` });
        continue;
      }
      seen.set(name, row);
      let decoded;
      try {
        decoded = await decodeImage(bytes, !embeddings);
      } catch (error) {
        ctx.issues.add({ row, column: null, message: `\`${name}\` is not an image Vicinal can read (${(error as Error).message.replace(/^Input buffer contains unsupported image format$/, "unsupported or damaged image data")})` });
        continue;
      }
      let vector = decoded.vector;
      if (embeddings) {
        const found = embeddingFor(embeddings.vectors, name);
        if (!found) {
          ctx.issues.add({ row, column: null, message: `\`${name}\` has no row in the embeddings file (match its file name in the id column)` });
          continue;
        }
        vector = found;
      }
      if (ctx.issues.count > 0) continue;
      const hash = createHash("sha256").update(bytes).digest("hex");
      const imageKey = `projects/${projectId}/images/${hash}.${decoded.format === "jpeg" ? "jpg" : decoded.format}`;
      const thumbKey = `projects/${projectId}/images/${hash}.thumb.webp`;
      await putObject(imageKey, bytes, contentTypes[decoded.format]);
      await putObject(thumbKey, decoded.thumb, "image/webp");
      yield { row, externalId: name, fields: { file: name, width: decoded.width, height: decoded.height, format: decoded.format }, vector, priorClassId: null, imageKey, thumbKey };
      if (await ctx.progress.tick(row, entries.length)) throw new ImportCancelled();
    }
    await ctx.progress.tick(entries.length, entries.length, true);
  }
  return { featureSchema, items: items() };
}
