import "fake-indexeddb/auto";
import "./support/session";
import { v7 as uuidv7 } from "uuid";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { fieldSessions } from "@/db/schema";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { createWindowcallDb } from "@/lib/offline/db";
import { createSessionLocal } from "@/lib/offline/record";
import { SyncClient } from "@/lib/offline/sync-client";
import { actAs } from "./support/session";
import { db, demoUser, getPool } from "./support/db";

afterAll(async () => {
  await getPool().end();
});

describe("the phone's outbox against the real push route", () => {
  it("moves a record the protocol refuses to the not-accepted list with its reason; the rest is sent", async () => {
    const ada = await demoUser("ada@example.com");
    actAs(ada);
    const device = createWindowcallDb(`verdicts-${uuidv7()}`);
    const fetch = async (url: string, init?: RequestInit) =>
      url === "/api/sync/push" ? pushRoute(new Request(`http://test${url}`, init)) : new Response("{}", { status: 404 });
    const client = new SyncClient({ db: device, fetch });
    // written by an older version of the app, before text was bounded: a NUL in the field's name
    const old = await createSessionLocal(device, { ownerId: ada.id, fieldName: "Old Meadow", conditions: {}, startedAtWallMs: 1_767_000_000_000 });
    await device.sessions.update(old.id, { fieldName: "Old\u0000Meadow" });
    const fine = await createSessionLocal(device, { ownerId: ada.id, fieldName: "New Meadow", conditions: {}, startedAtWallMs: 1_767_000_000_000 });

    expect(await client.flush()).toMatchObject({ kind: "ok", acked: 1, rejected: 1 });
    const status = client.status();
    expect(status.unsent).toBe(0);
    expect(status.rejected).toEqual([{ id: old.id, kind: "session", reason: expect.stringMatching(/NUL/) }]);
    expect(await db.select({ id: fieldSessions.id }).from(fieldSessions).where(eq(fieldSessions.id, fine.id))).toEqual([{ id: fine.id }]);
    expect(await db.select().from(fieldSessions).where(eq(fieldSessions.id, old.id))).toEqual([]);
    // nothing left to block: a later record goes straight through
    const later = await createSessionLocal(device, { ownerId: ada.id, fieldName: "Later Meadow", conditions: {}, startedAtWallMs: 1_767_000_000_000 });
    expect(await client.flush()).toMatchObject({ kind: "ok", acked: 1 });
    expect(await db.select({ id: fieldSessions.id }).from(fieldSessions).where(eq(fieldSessions.id, later.id))).toEqual([{ id: later.id }]);
    device.close();
  });
});
