import { AbortMultipartUploadCommand, CompleteMultipartUploadCommand, CreateMultipartUploadCommand, UploadPartCommand } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { S3Client } from "@aws-sdk/client-s3";
import { env } from "@/lib/env";
import { bucket, s3 } from "@/lib/storage/s3";
import { limits } from "./limits";

/** Signs with the host the browser reaches, like the foundation's presignPut. */
const presigner = new S3Client({
  region: env.S3_REGION,
  endpoint: env.S3_PUBLIC_ENDPOINT ?? env.S3_ENDPOINT,
  forcePathStyle: env.S3_FORCE_PATH_STYLE,
  credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
  requestChecksumCalculation: "WHEN_REQUIRED",
  responseChecksumValidation: "WHEN_REQUIRED",
});

export function partCount(size: number) {
  return Math.max(1, Math.ceil(size / limits.partSize));
}

/** Starts a multipart upload and signs one PUT URL per part. */
export async function startMultipart(key: string, size: number, contentType: string) {
  const out = await s3.send(new CreateMultipartUploadCommand({ Bucket: bucket, Key: key, ContentType: contentType }));
  if (!out.UploadId) throw new Error("the bucket did not start a multipart upload");
  const uploadId = out.UploadId;
  const parts = await Promise.all(
    Array.from({ length: partCount(size) }, async (_, i) => ({
      partNumber: i + 1,
      url: await getSignedUrl(presigner, new UploadPartCommand({ Bucket: bucket, Key: key, UploadId: uploadId, PartNumber: i + 1 }), { expiresIn: env.PRESIGN_SECONDS * 4 }),
    })),
  );
  return { multipartId: uploadId, partSize: limits.partSize, parts };
}

export async function completeMultipart(key: string, multipartId: string, parts: Array<{ partNumber: number; etag: string }>) {
  await s3.send(
    new CompleteMultipartUploadCommand({
      Bucket: bucket,
      Key: key,
      UploadId: multipartId,
      MultipartUpload: { Parts: [...parts].sort((a, b) => a.partNumber - b.partNumber).map((p) => ({ PartNumber: p.partNumber, ETag: p.etag })) },
    }),
  );
}

export async function abortMultipart(key: string, multipartId: string) {
  await s3.send(new AbortMultipartUploadCommand({ Bucket: bucket, Key: key, UploadId: multipartId })).catch(() => undefined);
}
