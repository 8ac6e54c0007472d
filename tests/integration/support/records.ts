import { v7 as uuidv7 } from "uuid";
import { getCatalogueTask } from "@/lib/tasks";
import { events, fieldSessions, runLanes, runs } from "@/db/schema";
import { db } from "./db";

/** Inserts a field session owned by `ownerId` (straight into the database: these tests are not about sync). */
export async function insertSession(ownerId: string): Promise<string> {
  const id = uuidv7();
  await db.insert(fieldSessions).values({ id, ownerId, fieldName: "Test Meadow", startedAt: new Date(1_767_000_000_000) });
  return id;
}

/**
 * Inserts a run in `sessionId` created by `createdBy` with these lanes (pilot account or null for
 * a guest), plus one launch per lane and a window start, recorded by `createdBy`.
 */
export async function insertRun(
  sessionId: string,
  createdBy: string,
  lanes: { pilotUserId: string | null; pilotName: string }[],
): Promise<string> {
  const id = uuidv7();
  const task = getCatalogueTask("H");
  await db.insert(runs).values({ id, sessionId, createdBy, task, taskCode: "H", edition: String(task.edition), createdAt: new Date(1_767_000_060_000) });
  await db.insert(runLanes).values(lanes.map((l, lane) => ({ runId: id, lane, pilotUserId: l.pilotUserId, pilotName: l.pilotName, resultTenths: 600 + lane })));
  const bodies = [{ kind: "window-start" }, ...lanes.map((_, lane) => ({ kind: "launch", lane }))];
  const deviceId = `records-${uuidv7()}`;
  await db.insert(events).values(
    bodies.map((body, i) => ({
      id: uuidv7(), runId: id, deviceId, seq: i + 1, recordedBy: createdBy, kind: body.kind, body,
      wallMs: 1_767_000_100_000 + i * 1000, monoMs: 1000 + i, pageId: "records", correctedMs: 1_767_000_100_000 + i * 1000,
    })),
  );
  return id;
}
