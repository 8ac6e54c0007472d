import { randomBytes } from "node:crypto";
import { PutObjectCommand } from "@aws-sdk/client-s3";
import { createPendingLog } from "@/db/queries/altimeter";
import { createModel } from "@/db/queries/models";
import { altimeterLogs } from "@/db/schema";
import { eq } from "drizzle-orm";
import { db } from "./db";
import { insertRun, insertSession } from "./records";
import { s3 } from "./altimeter";

/** A model in this user's hangar. */
export async function insertModel(ownerId: string, name = "Matrix glider"): Promise<string> {
  return (await createModel(db, { ownerId, input: { name, spanMm: 1495, massG: 240, marking: "blue", notes: "", status: "flying" } })).id;
}

/** A run this user recorded and flew (lane 0). */
export async function insertOwnRun(userId: string): Promise<string> {
  return insertRun(await insertSession(userId), userId, [{ pilotUserId: userId, pilotName: "Owner" }]);
}

/** A small valid log of a still logger, as the complete route reads it with LOG_MAPPING. */
export const LOG_CSV = `t,h\n${Array.from({ length: 20 }, (_, i) => `${i},${(100 + (i % 2) * 0.1).toFixed(1)}`).join("\n")}\n`;
export const LOG_MAPPING = { hasHeader: true, timeColumn: 1, timeKind: "seconds", utcOffsetMin: 0, valueColumn: 2, valueKind: "m" } as const;

/** A log of the user's lane, uploaded to the object server and waiting to be read ("pending"), or already read. */
export async function insertLog(userId: string, status: "pending" | "parsed"): Promise<string> {
  const runId = await insertOwnRun(userId);
  const objectKey = `logs/${runId}/${randomBytes(16).toString("base64url")}.csv`;
  const { client, bucket } = s3();
  await client.send(new PutObjectCommand({ Bucket: bucket, Key: objectKey, Body: LOG_CSV, ContentType: "text/csv" }));
  const log = await createPendingLog(db, { ownerId: userId, runId, lane: 0, objectKey, fileName: "still.csv", loggerName: "Matrix logger", sizeBytes: LOG_CSV.length });
  if (status === "parsed") await db.update(altimeterLogs).set({ status: "parsed", samples: 20 }).where(eq(altimeterLogs.id, log.id));
  return log.id;
}
