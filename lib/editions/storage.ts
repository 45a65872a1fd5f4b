import { createHash } from "node:crypto";
import { createReadStream } from "node:fs";
import { stat } from "node:fs/promises";
import { createInterface } from "node:readline";
import { DeleteObjectCommand, ListObjectsV2Command, PutObjectCommand } from "@aws-sdk/client-s3";
import { bucket, getObjectStream, s3 } from "@/lib/storage/s3";

export const editionFormats = ["csv", "jsonl", "parquet", "manifest"] as const;
export type EditionFormat = (typeof editionFormats)[number];

export const contentTypes: Record<EditionFormat | "index" | "diff", string> = {
  csv: "text/csv; charset=utf-8",
  jsonl: "application/x-ndjson; charset=utf-8",
  parquet: "application/vnd.apache.parquet",
  manifest: "application/json; charset=utf-8",
  index: "application/x-ndjson; charset=utf-8",
  diff: "text/csv; charset=utf-8",
};

const projectPrefix = (projectId: number) => `editions/${projectId}/`;
export const editionPrefix = (projectId: number, editionId: number) => `${projectPrefix(projectId)}${editionId}/`;

export function editionObjectKeys(projectId: number, editionId: number, number: number) {
  const base = `${editionPrefix(projectId, editionId)}edition-${number}`;
  return { csv: `${base}.csv`, jsonl: `${base}.jsonl`, parquet: `${base}.parquet`, manifest: `${base}.manifest.json`, index: `${base}.index.jsonl` };
}

/** The cached CSV list of changes from edition `fromId` to edition `toId`. */
export const diffObjectKey = (projectId: number, toId: number, fromId: number) => `${projectPrefix(projectId)}diffs/${toId}-from-${fromId}.csv`;

export function downloadName(projectName: string, number: number, format: EditionFormat): string {
  const slug = projectName.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || "project";
  const ext = format === "manifest" ? "manifest.json" : format;
  return `${slug}-edition-${number}.${ext}`;
}

export async function sha256File(path: string): Promise<string> {
  const hash = createHash("sha256");
  for await (const chunk of createReadStream(path)) hash.update(chunk as Buffer);
  return hash.digest("hex");
}

/** Streams a local file into the bucket (single PUT; S3 takes up to 5 GB this way). */
export async function uploadFile(key: string, path: string, contentType: string): Promise<number> {
  const { size } = await stat(path);
  await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: createReadStream(path), ContentLength: size, ContentType: contentType }));
  return size;
}

/** Deletes an edition's objects and every cached diff that involves it. */
export async function deleteEditionObjects(projectId: number, editionId: number): Promise<number> {
  const keys: string[] = [];
  for (const prefix of [editionPrefix(projectId, editionId), `${projectPrefix(projectId)}diffs/`]) {
    let token: string | undefined;
    do {
      const page = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token }));
      for (const o of page.Contents ?? []) {
        if (!o.Key) continue;
        const name = o.Key.slice(prefix.length);
        if (prefix.endsWith("diffs/") && !new RegExp(`^(${editionId}-from-\\d+|\\d+-from-${editionId})\\.csv$`).test(name)) continue;
        keys.push(o.Key);
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  }
  for (const key of keys) await s3.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
  return keys.length;
}

/** The lines of a text object, streamed. */
export async function* objectLines(key: string): AsyncGenerator<string> {
  const lines = createInterface({ input: (await getObjectStream(key)) as NodeJS.ReadableStream, crlfDelay: Number.POSITIVE_INFINITY });
  for await (const line of lines) if (line.length) yield line;
}
