import { v7 as uuidv7 } from "uuid";
import { describe, expect, it } from "vitest";
import { getMeta, setMeta } from "@/lib/offline/db";
import { recordEvent } from "@/lib/offline/record";
import { pullAll, type PullProgress } from "@/lib/offline/pull";
import { SyncClient } from "@/lib/offline/sync-client";
import { describePull } from "@/components/sync/describe-sync";
import { FakeServer, freshDbsPerTest, ManualTimers, serverWithData, stamp } from "./helpers";

const open = freshDbsPerTest();

describe("pull", () => {
  it("pages until hasMore is false, storing every item and the cursor", async () => {
    const { server, sessions: [session], runs: [run] } = await serverWithData(open, 5); // 7 items in the log
    server.pullPageSize = 3;
    const db = open();
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers() });
    expect(await client.pull()).toEqual({ kind: "ok", items: 7 });
    expect(server.requests.filter((r) => r.includes("/pull"))).toEqual([
      "GET /api/sync/pull?cursor=0&limit=500&total=1",
      "GET /api/sync/pull?cursor=1.3&limit=500",
      "GET /api/sync/pull?cursor=1.6&limit=500",
    ]);
    expect(await db.sessions.get(session!.id)).toEqual(session);
    expect(await db.runs.get(run!.id)).toEqual(run);
    expect(await db.events.count()).toBe(5);
    expect(await getMeta(db, "pullCursor")).toBe("1.7");
  });

  it("reports its progress page by page: about how many pages in all, then how far it got", async () => {
    const { server } = await serverWithData(open, 5); // 7 items in the log
    server.pullPageSize = 3;
    const db = open();
    const progress: (PullProgress | null)[] = [];
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers() });
    client.subscribe((s) => progress.push(s.pulling));
    await pullAll({ db, fetch: server.fetch, limit: 3, onProgress: (p) => progress.push(p) });
    expect(progress.filter((p) => p !== null)).toEqual([
      { page: 1, pages: 3, items: 3 },
      { page: 2, pages: 3, items: 6 },
      { page: 3, pages: 3, items: 7 },
    ]);
    expect(describePull({ page: 2, pages: 3, items: 6 })).toBe("Fetching records… 2 of ~3");
    expect(describePull({ page: 1, pages: 1, items: 7 })).toBe("Fetching records… 7");
    // the client's status carries it while the pull runs, and drops it when done
    const seen: (PullProgress | null)[] = [];
    client.subscribe((s) => seen.push(s.pulling));
    await setMeta(db, "pullCursor", "0");
    await client.pull();
    expect(seen.filter((p) => p !== null).map((p) => [p!.page, p!.items])).toEqual([[1, 3], [2, 6], [3, 7]]);
    expect(client.status().pulling).toBeNull();
  });

  it("is idempotent: pulling the same pages again changes nothing", async () => {
    const { server } = await serverWithData(open, 4);
    server.pullPageSize = 2;
    const db = open();
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers() });
    await client.pull();
    const snapshot = { events: await db.events.toArray(), sessions: await db.sessions.toArray(), runs: await db.runs.toArray() };
    await setMeta(db, "pullCursor", "0"); // as if the cursor write had been lost
    await client.pull();
    expect({ events: await db.events.toArray(), sessions: await db.sessions.toArray(), runs: await db.runs.toArray() }).toEqual(snapshot);
  });

  it("continues from the stored cursor", async () => {
    const { server } = await serverWithData(open, 2);
    const db = open();
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers() });
    await client.pull();
    await client.pull();
    expect(server.requests.filter((r) => r.includes("/pull")).at(-1)).toBe("GET /api/sync/pull?cursor=1.4&limit=500&total=1");
  });

  it("pulls from 0 again when what the user may see changed (a new coach grant), then carries on", async () => {
    const { server } = await serverWithData(open, 3);
    server.scope = "";
    const db = open();
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers() });
    await client.pull();
    expect(await getMeta(db, "pullScope")).toBe("");
    await db.events.clear(); // stands for rows the server had not shown this user before the grant
    server.scope = "grant-1";
    expect(await client.pull()).toEqual({ kind: "ok", items: 5 });
    expect(await db.events.count()).toBe(3);
    expect(await getMeta(db, "pullScope")).toBe("grant-1");
    await client.pull();
    expect(server.requests.filter((r) => r.includes("/pull")).slice(-3)).toEqual([
      "GET /api/sync/pull?cursor=1.5&limit=500&total=1",
      "GET /api/sync/pull?cursor=0&limit=500&total=1",
      "GET /api/sync/pull?cursor=1.5&limit=500&total=1",
    ]);
  });

  it("names the device database's account in every push and pull (a shared phone; device-user.ts)", async () => {
    const server = new FakeServer();
    const db = open();
    const account = "0190a7c2-0000-7000-8000-000000000001";
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers(), account: () => account });
    await recordEvent(db, { runId: uuidv7(), body: { kind: "window-start" }, stamp: stamp() });
    await client.sync();
    expect(server.pushes.map((p) => (p as { account?: string }).account)).toEqual([account]);
    expect(server.requests.filter((r) => r.includes("/pull"))).toEqual([`GET /api/sync/pull?cursor=0&limit=500&total=1&account=${account}`]);
  });

  it("stops with an error when the server's cursor does not advance", async () => {
    const db = open();
    let calls = 0;
    const fetch = async () => {
      calls++;
      return Response.json({ items: [], nextCursor: "0", hasMore: true });
    };
    const client = new SyncClient({ db, fetch, timers: new ManualTimers() });
    expect(await client.pull()).toMatchObject({ kind: "bad-reply", message: expect.stringMatching(/did not advance/) });
    expect(calls).toBe(1);
    expect(client.status().lastError).toMatch(/did not advance/);
  });

  it("refuses a page with one malformed item whole: nothing of it stored, the cursor where it was", async () => {
    const db = open();
    const good = { type: "session", seq: 1, data: { id: uuidv7(), ownerId: "u1", fieldName: "East field", conditions: {}, startedAtWallMs: 1 } };
    const items = [...Array.from({ length: 60 }, () => good), { type: "event", seq: 2, data: { id: "not-a-uuid" } }];
    const fetch = async () => Response.json({ items, nextCursor: "1.2", hasMore: false });
    expect(await pullAll({ db, fetch })).toMatchObject({ kind: "bad-reply", message: expect.stringMatching(/^item 61: /) });
    expect(await db.sessions.count()).toBe(0);
    expect(await getMeta(db, "pullCursor")).toBeUndefined();
  });

  it("keeps what earlier pages stored when a later page fails", async () => {
    const { server } = await serverWithData(open, 3);
    server.pullPageSize = 2;
    const db = open();
    const flaky = async (url: string, init?: RequestInit) =>
      url.includes("cursor=1.2&") ? new Response("", { status: 502 }) : server.fetch(url, init);
    const client = new SyncClient({ db, fetch: flaky, timers: new ManualTimers() });
    expect(await client.pull()).toMatchObject({ kind: "http", status: 502 });
    expect(await getMeta(db, "pullCursor")).toBe("1.2");
    expect((await db.sessions.count()) + (await db.runs.count())).toBe(2);
  });

  it("brings this device's own pushed events back without duplicating them", async () => {
    const server = new FakeServer();
    const db = open();
    const client = new SyncClient({ db, fetch: server.fetch, timers: new ManualTimers() });
    const ev = await recordEvent(db, { runId: uuidv7(), body: { kind: "window-start" }, stamp: stamp() });
    await client.sync();
    expect(await db.events.toArray()).toEqual([ev]);
  });
});
