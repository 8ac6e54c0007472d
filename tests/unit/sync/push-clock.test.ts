import { v7 as uuidv7 } from "uuid";
import { afterEach, describe, expect, it } from "vitest";
import { listClockEstimates } from "@/lib/offline/clock-sync";
import type { WindowcallDb } from "@/lib/offline/db";
import { recordEvent } from "@/lib/offline/record";
import { SyncClient } from "@/lib/offline/sync-client";
import { FakeServer, freshDb, ManualTimers, stamp } from "../offline/helpers";

const dbs: WindowcallDb[] = [];
afterEach(() => dbs.splice(0).forEach((db) => db.close()));

/** A FakeServer that also answers /api/time with a server 250 ms ahead of the device. */
function setup() {
  const db = freshDb();
  dbs.push(db);
  const server = new FakeServer();
  let now = 1_700_000_000_000;
  const fetch = async (url: string, init?: RequestInit) => {
    if (url === "/api/time") {
      const { t1 } = JSON.parse(String(init?.body)) as { t1: number };
      now += 5; // 5 ms each way: θ = ((T2 − T1) + (T3 − T4)) / 2 = 250 (RFC 5905 §8)
      const server = now + 250;
      now += 5;
      return Response.json({ t1, t2: server, t3: server });
    }
    return server.fetch(url, init);
  };
  const client = new SyncClient({ db, fetch, timers: new ManualTimers(), clock: { now: () => now } });
  return { db, server, client };
}

describe("push carries the device's clock estimates (SYNC.md §4)", () => {
  it("sends a measurement made after the last push even when the outbox is empty, once", async () => {
    const { db, server, client } = setup();
    await client.measureClock();
    const [estimate] = await listClockEstimates(db);
    expect(estimate?.thetaMs).toBe(250);
    expect(await client.flush()).toEqual({ kind: "ok", acked: 0, rejected: 0 });
    expect(server.pushes).toHaveLength(1);
    expect(server.pushes[0]).toMatchObject({ events: [], sessions: [], runs: [], clockEstimates: [estimate] });
    await client.flush();
    expect(server.pushes).toHaveLength(1); // nothing new to tell
  });

  it("sends every stored estimate with queued events", async () => {
    const { db, server, client } = setup();
    await client.measureClock();
    await client.measureClock();
    await recordEvent(db, { runId: uuidv7(), body: { kind: "launch", lane: 0 }, stamp: stamp() });
    await client.flush();
    expect(server.pushes).toHaveLength(1);
    expect(server.pushes[0]?.events).toHaveLength(1);
    expect(server.pushes[0]?.clockEstimates).toHaveLength(2);
  });

  it("sends no clock-only push for a device that never measured", async () => {
    const { server, client } = setup();
    await client.flush();
    expect(server.pushes).toHaveLength(0);
  });
});
