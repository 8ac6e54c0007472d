// The local object-storage fake: s3rver (an S3-compatible server) on 127.0.0.1 with its objects in
// $S3_DIR, and the app's private bucket created at start. Started and stopped by scripts/lib.sh
// (s3_up / fakes_stop_if_started); never used in production, where S3_ENDPOINT names a real service.
//   S3_PORT    the port to listen on (127.0.0.1 only)
//   S3_DIR     where the objects live (created if missing)
//   S3_BUCKET  the bucket to create (private: s3rver answers only signed requests for it)
import { mkdirSync } from "node:fs";
import S3rver from "s3rver";

const port = Number(process.env.S3_PORT);
const directory = process.env.S3_DIR ?? ".data/s3";
const bucket = process.env.S3_BUCKET ?? "windowcall-logs";
mkdirSync(directory, { recursive: true });

// The browser PUTs straight to a presigned URL, so the bucket answers CORS for any origin; the
// signature, not the origin, is what lets a request in.
const cors = `<CORSConfiguration><CORSRule><AllowedOrigin>*</AllowedOrigin><AllowedMethod>PUT</AllowedMethod>
<AllowedMethod>GET</AllowedMethod><AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader>
<MaxAgeSeconds>3000</MaxAgeSeconds></CORSRule></CORSConfiguration>`;

const server = new S3rver({
  address: "127.0.0.1",
  port,
  directory,
  silent: true,
  configureBuckets: [{ name: bucket, configs: [cors] }],
});

server
  .run()
  .then(() => console.log(`[s3] s3rver on http://127.0.0.1:${port}, bucket ${bucket}, data in ${directory}`))
  .catch((e: Error) => {
    console.error("[s3] could not start:", e.message);
    process.exit(1);
  });

const stop = () => {
  server.close().finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
