import { v7 as uuidv7 } from "uuid";
import { describe, expect, it } from "vitest";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { SyncClient } from "@/lib/offline/sync-client";
import { FakeServer, freshDbsPerTest, ManualTimers, stamp } from "./helpers";

const open = freshDbsPerTest();

function setup() {
  const db = open();
  const server = new FakeServer();
  const timers = new ManualTimers();
  let now = 1_700_000_000_000;
  const client = new SyncClient({ db, fetch: server.fetch, timers, clock: { now: () => now }, random: () => 0.5 });
  const record = (lane = 0) => recordEvent(db, { runId, body: { kind: "launch", lane }, stamp: stamp() });
  return { db, server, timers, client, record, advance: (ms: number) => (now += ms), now: () => now };
}
const runId = uuidv7();

describe("flush", () => {
  it("sends the outbox and deletes entries once acknowledged", async () => {
    const { db, server, client, record } = setup();
    const a = await record();
    const b = await record(1);
    expect(await client.flush()).toEqual({ kind: "ok", acked: 2, rejected: 0 });
    expect(server.eventIds()).toEqual([a.id, b.id]);
    expect(await db.outbox.count()).toBe(0);
    expect(await db.events.count()).toBe(2); // the events themselves stay on the device
    expect(client.status()).toMatchObject({ unsent: 0, state: "idle", lastError: null });
  });

  it("deletes only the entries the server acknowledged", async () => {
    const { db, server, client, record } = setup();
    const a = await record();
    const b = await record();
    server.silentIds.add(b.id); // applied but missing from the reply (a lost ack)
    await client.flush();
    expect(await db.outbox.get(a.id)).toBeUndefined();
    expect(await db.outbox.get(b.id)).toMatchObject({ attempts: 2, lastError: expect.stringMatching(/acknowledged/) });
  });

  it("a resend after a lost ack comes back as duplicate: deleted, stored once on the server", async () => {
    const { db, server, client, record } = setup();
    const a = await record();
    server.silentIds.add(a.id);
    await client.flush();
    expect(await db.outbox.count()).toBe(1);
    server.silentIds.clear();
    expect(await client.flush()).toMatchObject({ kind: "ok", acked: 1 });
    expect(await db.outbox.count()).toBe(0);
    expect(server.eventIds()).toEqual([a.id]);
  });

  it("keeps a rejected entry with its reason and never sends it again", async () => {
    const { db, server, client, record } = setup();
    const bad = await record();
    const good = await record();
    server.rejectIds.set(bad.id, "run belongs to someone else");
    await client.flush();
    expect(await db.outbox.get(bad.id)).toMatchObject({ rejected: { reason: "run belongs to someone else" } });
    expect(client.status().rejected).toEqual([{ id: bad.id, kind: "event", reason: "run belongs to someone else" }]);
    expect(client.status().unsent).toBe(0);
    const later = await record();
    await client.flush();
    expect(server.pushes.at(-1)!.events.map((e) => e.id)).toEqual([later.id]);
    expect(server.pushes.flatMap((p) => p.events.map((e) => e.id)).filter((id) => id === bad.id)).toHaveLength(1);
    expect(server.eventIds()).toEqual([good.id, later.id]);
  });

  it("rejects locally a record that could never pass validation, without blocking the rest", async () => {
    const { db, server, client, record } = setup();
    const broken = await record();
    await db.events.update(broken.id, { seq: -1 }); // corrupted on the device
    const fine = await record();
    await client.flush();
    expect((await db.outbox.get(broken.id))?.rejected?.reason).toMatch(/invalid event/);
    expect(server.eventIds()).toEqual([fine.id]);
  });

  it("sends in queue order in batches of at most 200, session and run before their events", async () => {
    const { db, server, client } = setup();
    const session = await createSessionLocal(db, { ownerId: "u1", fieldName: "Field", conditions: {}, startedAtWallMs: 1 });
    const run = await createRunLocal(db, { sessionId: session.id, task: {}, lanes: [{ lane: 0, pilotName: "P" }], createdAtWallMs: 2 });
    for (let i = 0; i < 448; i++) await recordEvent(db, { runId: run.id, body: { kind: "launch", lane: 0 }, stamp: stamp() });
    await client.flush();
    const sizes = server.pushes.map((p) => p.sessions.length + p.runs.length + p.events.length);
    expect(sizes).toEqual([200, 200, 50]);
    expect(server.pushes[0]!.sessions.map((s) => s.id)).toEqual([session.id]);
    expect(server.pushes[0]!.runs.map((r) => r.id)).toEqual([run.id]);
    const seqs = server.pushes.flatMap((p) => p.events.map((e) => e.seq));
    expect(seqs).toEqual(Array.from({ length: 448 }, (_, i) => i + 1));
    expect(await db.outbox.count()).toBe(0);
  });

  it("is single-flight: concurrent calls share one request and one promise", async () => {
    const { server, client, record } = setup();
    await record();
    const p1 = client.flush();
    const p2 = client.flush();
    expect(p2).toBe(p1);
    await Promise.all([p1, p2]);
    expect(server.pushes).toHaveLength(1);
  });

  it("a write made during a flush is sent by that same flush", async () => {
    const { server, client, record } = setup();
    await record();
    const p = client.flush();
    const late = await record(); // lands while the first push is in flight
    void client.flush(); // what notifyWrite's timer would do
    await p;
    expect(server.eventIds()).toContain(late.id);
  });
});

describe("failures and backoff", () => {
  it("backs off exponentially with jitter on a 500, counting attempts", async () => {
    const { db, server, client, timers, record, now } = setup();
    const a = await record();
    server.failures.push(500, 500);
    expect(await client.flush()).toMatchObject({ kind: "http", status: 500 });
    // first retry: 1000 ms × (1/2 + 0.5 × 1/2) with random() = 0.5
    expect(timers.delays()).toEqual([750]);
    expect(client.status()).toMatchObject({ state: "idle", lastError: "server answered 500: boom", nextRetryAt: now() + 750, unsent: 1 });
    expect(await db.outbox.get(a.id)).toMatchObject({ attempts: 1 });

    timers.fireAll(); // the scheduled retry fails again
    await until(() => timers.delays().length === 1 && timers.delays()[0] === 1500);
    expect(await db.outbox.get(a.id)).toMatchObject({ attempts: 2 });

    timers.fireAll(); // and then succeeds (push + pull)
    await until(() => client.status().unsent === 0 && client.status().state === "idle");
    expect(timers.delays()).toEqual([]);
    expect(client.status()).toMatchObject({ lastError: null, nextRetryAt: null });
    expect(server.eventIds()).toEqual([a.id]);
  });

  it("reports offline and backs off when fetch throws", async () => {
    const { client, server, timers, record } = setup();
    await record();
    server.failures.push("throw");
    expect(await client.flush()).toMatchObject({ kind: "network" });
    expect(client.status()).toMatchObject({ state: "offline", lastError: "network: Failed to fetch", unsent: 1 });
    expect(timers.delays()).toEqual([750]);
  });

  it("caps the wait at 60 s however many failures", async () => {
    const { client, server, timers, record } = setup();
    await record();
    for (let i = 0; i < 12; i++) {
      server.failures.push(503);
      await client.flush();
    }
    expect(timers.delays()).toHaveLength(1);
    expect(timers.delays()[0]).toBe(45_000); // 60 000 × (1/2 + 0.5 × 1/2)
  });

  it("on 401 stops, reports signed out and schedules nothing until resumed", async () => {
    const { client, server, timers, record } = setup();
    await record();
    server.failures.push(401);
    expect(await client.flush()).toEqual({ kind: "signed-out" });
    expect(client.status()).toMatchObject({ state: "signed-out", unsent: 1 });
    expect(timers.delays()).toEqual([]);
    client.notifyWrite();
    timers.fireAll(); // the debounced flush must not run while signed out
    client.onOnline();
    await new Promise((r) => setTimeout(r, 20));
    expect(server.pushes).toHaveLength(0);
    await client.resume();
    expect(server.pushes).toHaveLength(1);
    expect(client.status()).toMatchObject({ state: "idle", unsent: 0 });
  });

  it("notifyWrite debounces: one flush after a burst of writes", async () => {
    const { client, server, timers, record } = setup();
    for (let i = 0; i < 5; i++) {
      await record();
      client.notifyWrite();
    }
    expect(timers.delays()).toEqual([500]);
    timers.fireAll();
    await until(() => server.pushes.length === 1 && client.status().unsent === 0);
    expect(server.pushes[0]!.events).toHaveLength(5);
  });
});

async function until(cond: () => boolean, ms = 2000): Promise<void> {
  const end = Date.now() + ms;
  while (!cond()) {
    if (Date.now() > end) throw new Error("condition not reached");
    await new Promise((r) => setTimeout(r, 5));
  }
}
