import { v7 as uuidv7 } from "uuid";
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { and, eq } from "drizzle-orm";
import { events, runLanes } from "@/db/schema";
import { db } from "./db";

/** The local object server through the SDK, as the scripts configure it (scripts/lib.sh s3_up). */
export function s3(): { client: S3Client; bucket: string } {
  const endpoint = process.env.S3_ENDPOINT;
  if (!endpoint) throw new Error("S3_ENDPOINT is not set: run integration tests through scripts/integration-local.sh or npm test");
  const credentials = { accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "S3RVER", secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER" };
  return { client: new S3Client({ endpoint, region: process.env.S3_REGION ?? "us-east-1", forcePathStyle: true, credentials }), bucket: process.env.S3_BUCKET ?? "windowcall-logs" };
}

/** The keys stored under a prefix. */
export async function storedKeys(prefix: string): Promise<string[]> {
  const { client, bucket } = s3();
  const out = await client.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix }));
  return (out.Contents ?? []).map((o) => o.Key ?? "");
}

/**
 * Gives a lane derived flights launched at these corrected instants (60 s each), shaped as
 * deriveAndStoreRuns stores them: launchMs/landMs from the working-time signal (here the first
 * launch minus 10 s), launchAtMs/landAtMs on the corrected clock.
 */
export async function setLaneFlights(runId: string, lane: number, launches: number[]): Promise<void> {
  const signalMs = (launches[0] ?? 0) - 10_000;
  const flights = launches.map((at, index) => ({
    index, launchMs: at - signalMs, landMs: at + 60_000 - signalMs, launchAtMs: at, landAtMs: at + 60_000,
    status: "counted", reason: null, timeTenths: 600, creditedTenths: 600, targetSec: null,
  }));
  await db.update(runLanes).set({ derived: { flights } }).where(and(eq(runLanes.runId, runId), eq(runLanes.lane, lane)));
}

/** Records a "model" event for the lane at this corrected instant. */
export async function chooseModel(runId: string, lane: number, modelId: string, atMs: number, recordedBy: string): Promise<void> {
  const body = { kind: "model", lane, modelId };
  await db.insert(events).values({
    id: uuidv7(), runId, deviceId: `model-${uuidv7()}`, seq: 1, recordedBy, kind: "model", body, wallMs: atMs, monoMs: 1, pageId: "test", correctedMs: atMs,
  });
}
