import "server-only";
import { randomBytes } from "node:crypto";
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";

/**
 * Object storage for altimeter logs, through the AWS SDK. S3_ENDPOINT, S3_BUCKET, S3_REGION,
 * S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY come from the environment; our scripts point them at
 * the local s3rver (scripts/s3-server.ts). The bucket is private: the browser reaches an object
 * only through a presigned URL that lives a few minutes.
 */
export const PUT_TTL_S = 300;
export const GET_TTL_S = 60;

const cache = globalThis as unknown as { windowcallS3?: { key: string; client: S3Client } };

function settings() {
  const endpoint = process.env.S3_ENDPOINT;
  const bucket = process.env.S3_BUCKET;
  if (!endpoint || !bucket) throw new Error("object storage is not configured (S3_ENDPOINT, S3_BUCKET)");
  return {
    endpoint,
    bucket,
    region: process.env.S3_REGION ?? "us-east-1",
    credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "", secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "" },
  };
}

function client(): { client: S3Client; bucket: string } {
  const s = settings();
  const key = `${s.endpoint}|${s.region}|${s.credentials.accessKeyId}`;
  if (cache.windowcallS3?.key !== key) {
    cache.windowcallS3 = { key, client: new S3Client({ endpoint: s.endpoint, region: s.region, forcePathStyle: true, credentials: s.credentials }) };
  }
  return { client: cache.windowcallS3.client, bucket: s.bucket };
}

/** A new object key: 128 random bits, nothing a user chose or could guess. */
export function newObjectKey(prefix: string): string {
  return `${prefix}/${randomBytes(16).toString("base64url")}.csv`;
}

/** A URL the browser may PUT exactly this content type to, for PUT_TTL_S seconds. */
export function presignPut(key: string, contentType: string): Promise<string> {
  const { client: c, bucket } = client();
  return getSignedUrl(c, new PutObjectCommand({ Bucket: bucket, Key: key, ContentType: contentType }), { expiresIn: PUT_TTL_S });
}

/** A URL that downloads the object as a named file, for GET_TTL_S seconds. */
export function presignGet(key: string, fileName: string): Promise<string> {
  const { client: c, bucket } = client();
  const safe = fileName.replace(/[^\w.-]+/g, "_");
  return getSignedUrl(c, new GetObjectCommand({ Bucket: bucket, Key: key, ResponseContentDisposition: `attachment; filename="${safe}"` }), { expiresIn: GET_TTL_S });
}

/** Size and content type of a stored object, or null when there is none. */
export async function headObject(key: string): Promise<{ size: number; contentType: string } | null> {
  const { client: c, bucket } = client();
  try {
    const head = await c.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
    return { size: head.ContentLength ?? 0, contentType: head.ContentType ?? "" };
  } catch (e) {
    if ((e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return null;
    throw e;
  }
}

export async function readObjectText(key: string): Promise<string> {
  const { client: c, bucket } = client();
  const out = await c.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
  return (await out.Body?.transformToString("utf-8")) ?? "";
}

/** Deletes the object (nothing happens when it is already gone). */
export async function deleteObject(key: string): Promise<void> {
  const { client: c, bucket } = client();
  await c.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
}
