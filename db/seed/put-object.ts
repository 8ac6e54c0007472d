import { PutObjectCommand, S3Client } from "@aws-sdk/client-s3";

/** Stores a demo object straight through the SDK (the seed runs on the server, no presigned URL needed). */
export async function putDemoObject(key: string, body: string): Promise<void> {
  const client = new S3Client({
    endpoint: process.env.S3_ENDPOINT, region: process.env.S3_REGION ?? "us-east-1", forcePathStyle: true,
    credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "", secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "" },
  });
  await client.send(new PutObjectCommand({ Bucket: process.env.S3_BUCKET, Key: key, Body: body, ContentType: "text/csv" }));
  client.destroy();
}
