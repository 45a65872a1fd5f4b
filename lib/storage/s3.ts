import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  PutBucketCorsCommand,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { env } from "@/lib/env";

function makeClient(endpoint: string | undefined) {
  return new S3Client({
    region: env.S3_REGION,
    endpoint,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    // A store that stops answering must fail the request in seconds, not hang an import or a page.
    maxAttempts: 3,
    requestHandler: { connectionTimeout: 5_000, requestTimeout: 60_000 },
  });
}

/** Server-to-bucket client. */
export const s3 = makeClient(env.S3_ENDPOINT);
/** Signs URLs with the host the browser reaches (localhost, not 127.0.0.1, locally). */
const presigner = makeClient(env.S3_PUBLIC_ENDPOINT ?? env.S3_ENDPOINT);
export const bucket = env.S3_BUCKET;

export async function ensureBucket(allowedOrigins: string[]) {
  try {
    await s3.send(new HeadBucketCommand({ Bucket: bucket }));
  } catch {
    await s3.send(new CreateBucketCommand({ Bucket: bucket }));
  }
  await s3.send(
    new PutBucketCorsCommand({
      Bucket: bucket,
      CORSConfiguration: {
        CORSRules: [
          { AllowedOrigins: allowedOrigins, AllowedMethods: ["GET", "PUT", "HEAD"], AllowedHeaders: ["*"], ExposeHeaders: ["ETag"], MaxAgeSeconds: 3000 },
        ],
      },
    }),
  );
}

export async function putObject(key: string, body: Buffer | Uint8Array | string, contentType = "application/octet-stream") {
  await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType }));
}

export async function getObjectBytes(key: string): Promise<Uint8Array> {
  const out = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
  if (!out.Body) throw new Error(`object ${key} has no body`);
  return out.Body.transformToByteArray();
}

export async function getObjectStream(key: string) {
  const out = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
  if (!out.Body) throw new Error(`object ${key} has no body`);
  return out.Body as NodeJS.ReadableStream;
}

export async function headObject(key: string) {
  return s3.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
}

export async function deleteObject(key: string) {
  await s3.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
}

/** A short-lived URL for one object (GET). */
export function presignGet(key: string, seconds = env.PRESIGN_SECONDS, downloadName?: string) {
  return getSignedUrl(
    presigner,
    new GetObjectCommand({
      Bucket: bucket,
      Key: key,
      ResponseContentDisposition: downloadName ? `attachment; filename="${downloadName.replace(/["\\\r\n]/g, "_")}"` : undefined,
    }),
    { expiresIn: seconds },
  );
}

/** A short-lived URL to PUT one object. */
export function presignPut(key: string, contentType: string, seconds = env.PRESIGN_SECONDS) {
  return getSignedUrl(presigner, new PutObjectCommand({ Bucket: bucket, Key: key, ContentType: contentType }), { expiresIn: seconds });
}

export async function storageHealthy(): Promise<boolean> {
  try {
    await s3.send(new HeadBucketCommand({ Bucket: bucket }));
    return true;
  } catch {
    return false;
  }
}
