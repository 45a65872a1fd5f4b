import { GetObjectCommand } from "@aws-sdk/client-s3";
import type { AsyncBuffer } from "hyparquet";
import { bucket, getObjectStream, headObject, s3 } from "@/lib/storage/s3";

export function uploadKey(projectId: number, uploadId: string, fileName: string) {
  const safe = fileName.normalize("NFC").replace(/[^\p{L}\p{N}._-]+/gu, "_").slice(-120) || "file";
  return `projects/${projectId}/uploads/${uploadId}/${safe}`;
}

export async function objectSize(key: string): Promise<number> {
  const head = await headObject(key);
  return Number(head.ContentLength ?? 0);
}

export async function getRange(key: string, start: number, endExclusive: number): Promise<Uint8Array> {
  if (endExclusive <= start) return new Uint8Array(0);
  const out = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key, Range: `bytes=${start}-${endExclusive - 1}` }));
  if (!out.Body) return new Uint8Array(0);
  return out.Body.transformToByteArray();
}

/** Random access to an object through ranged GETs (Parquet needs its footer first). */
export async function objectAsyncBuffer(key: string): Promise<AsyncBuffer> {
  const size = await objectSize(key);
  return {
    byteLength: size,
    async slice(start: number, end?: number) {
      const bytes = await getRange(key, start, end ?? size);
      return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
    },
  };
}

export async function objectChunks(key: string): Promise<AsyncIterable<Uint8Array>> {
  return (await getObjectStream(key)) as unknown as AsyncIterable<Uint8Array>;
}
