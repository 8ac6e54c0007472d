import "./support/session";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { POST as presign } from "@/app/api/runs/[runId]/logs/route";
import { altimeterLogs } from "@/db/schema";
import { actAs } from "./support/session";
import { db, freshUser, getPool } from "./support/db";
import { storedKeys } from "./support/altimeter";
import { insertLog, insertOwnRun, LOG_MAPPING } from "./support/hangar-records";

afterAll(async () => {
  await getPool().end();
});

const json = (body: unknown) => new Request("http://test/api", { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const rowOf = async (id: string) => (await db.select().from(altimeterLogs).where(eq(altimeterLogs.id, id)))[0];

describe("uploads never completed are cleaned up on the owner's next upload", () => {
  it("a pending upload older than an hour goes with its object; a recent one, a read log and another pilot's stay", async () => {
    const pilot = await freshUser("logs-stale");
    const other = await freshUser("logs-stale-other");
    const stale = await insertLog(pilot.id, "pending");
    const fresh = await insertLog(pilot.id, "pending");
    const parsed = await insertLog(pilot.id, "parsed");
    const othersStale = await insertLog(other.id, "pending");
    const twoHoursAgo = new Date(Date.now() - 2 * 3600_000);
    for (const id of [stale, parsed, othersStale]) await db.update(altimeterLogs).set({ createdAt: twoHoursAgo }).where(eq(altimeterLogs.id, id));
    const staleKey = (await rowOf(stale))!.objectKey;
    expect(await storedKeys(staleKey)).toEqual([staleKey]);

    actAs(pilot);
    const runId = await insertOwnRun(pilot.id);
    const res = await presign(json({ lane: 0, fileName: "next.csv", sizeBytes: 100, contentType: "text/csv", loggerName: "L", mapping: LOG_MAPPING, startAtMs: Date.now() }), { params: Promise.resolve({ runId }) });
    expect(res.status).toBe(201);

    expect(await rowOf(stale)).toBeUndefined();
    expect(await storedKeys(staleKey)).toEqual([]);
    for (const id of [fresh, parsed, othersStale]) expect(await rowOf(id)).toBeDefined();
    const othersKey = (await rowOf(othersStale))!.objectKey;
    expect(await storedKeys(othersKey)).toEqual([othersKey]);
  });
});
