import { v7 as uuidv7 } from "uuid";
import { afterEach } from "vitest";
import type { RunEvent, Stamp } from "@/lib/events/schema";
import { createWindowcallDb, type WindowcallDb } from "@/lib/offline/db";
import type { RunEntity, SessionEntity } from "@/lib/events/entities";
import { createRunLocal, createSessionLocal, recordEvent } from "@/lib/offline/record";
import { SyncClient, type Timers } from "@/lib/offline/sync-client";
import { pushRequestSchema, type Ack, type PushRequest } from "@/lib/validations/sync";

/** A fresh, uniquely named database (fake-indexeddb, see tests/unit/setup.ts). */
export function freshDb(): WindowcallDb {
  return createWindowcallDb(`test-${uuidv7()}`);
}

/**
 * Opens databases for the calling test file (a fresh one, or the one given: e.g. a second tab on the same name);
 * each is closed after the test that opened it.
 */
export function freshDbsPerTest(): (db?: WindowcallDb) => WindowcallDb {
  const dbs: WindowcallDb[] = [];
  afterEach(() => dbs.splice(0).forEach((db) => db.close()));
  return (db = freshDb()) => {
    dbs.push(db);
    return db;
  };
}

/** A server that already holds, pushed by another phone, a session at each of `fields`, a run in each and `n` launches per run. */
export async function serverWithData(open: () => WindowcallDb, n: number, fields: readonly string[] = ["East field"]) {
  const server = new FakeServer();
  const other = open();
  const phone = new SyncClient({ db: other, fetch: server.fetch, timers: new ManualTimers() });
  const sessions: SessionEntity[] = [];
  const runs: RunEntity[] = [];
  for (const fieldName of fields) {
    const session = await createSessionLocal(other, { ownerId: "u1", fieldName, conditions: {}, startedAtWallMs: 1 });
    const run = await createRunLocal(other, { sessionId: session.id, task: {}, lanes: [{ lane: 0, pilotName: "P" }], createdAtWallMs: 2 });
    for (let i = 0; i < n; i++) await recordEvent(other, { runId: run.id, body: { kind: "launch", lane: 0 }, stamp: stamp() });
    sessions.push(session);
    runs.push(run);
  }
  await phone.flush();
  return { server, sessions, runs };
}

export const stamp = (wallMs = 1_700_000_000_000): Stamp => ({ wallMs, monoMs: 1234.5, pageId: "page-1", offset: null });

/** Timers the test fires by hand. */
export class ManualTimers implements Timers {
  private next = 1;
  readonly pending = new Map<number, { fn: () => void; ms: number }>();
  set(fn: () => void, ms: number): number {
    const id = this.next++;
    this.pending.set(id, { fn, ms });
    return id;
  }
  clear(handle: unknown): void {
    this.pending.delete(handle as number);
  }
  delays(): number[] {
    return [...this.pending.values()].map((t) => t.ms);
  }
  /** Fire every pending timer once. */
  fireAll(): void {
    const due = [...this.pending.entries()];
    this.pending.clear();
    for (const [, t] of due) t.fn();
  }
}

type Item = { type: "event"; data: RunEvent } | { type: "session"; data: SessionEntity } | { type: "run"; data: RunEntity };

/**
 * An in-memory stand-in for the sync routes: applies each item once by id (a second push is
 * a "duplicate"), keeps a server sequence for pulls, and can be told to fail or misbehave.
 */
export class FakeServer {
  readonly log: { seq: number; item: Item }[] = [];
  readonly pushes: PushRequest[] = [];
  readonly requests: string[] = [];
  rejectIds = new Map<string, string>();
  /** Ids the server applies but leaves out of its reply. */
  silentIds = new Set<string>();
  /** Responses to use for the next requests, before normal handling. */
  failures: ("throw" | number)[] = [];
  pullPageSize = 100;
  /** The visibility fingerprint pull replies carry (undefined: an older server that sends none). */
  scope: string | undefined = undefined;
  /** Run ids the first page of a pull from the start says to forget. */
  forget: string[] = [];

  fetch = async (url: string, init?: RequestInit): Promise<Response> => {
    this.requests.push(`${init?.method ?? "GET"} ${url}`);
    const failure = this.failures.shift();
    if (failure === "throw") throw new TypeError("Failed to fetch");
    if (typeof failure === "number") return Response.json({ error: { code: "x", message: "boom" } }, { status: failure });
    if (url.startsWith("/api/sync/push")) return this.push(JSON.parse(String(init?.body)));
    if (url.startsWith("/api/sync/pull")) return this.pull(new URL(url, "http://x").searchParams);
    return new Response("not found", { status: 404 });
  };

  private push(body: unknown): Response {
    const req = pushRequestSchema.parse(body); // the client must speak the protocol exactly
    this.pushes.push(req);
    const acks: Ack[] = [];
    const items: Item[] = [
      ...req.sessions.map((data) => ({ type: "session" as const, data })),
      ...req.runs.map((data) => ({ type: "run" as const, data })),
      ...req.events.map((data) => ({ type: "event" as const, data })),
    ];
    for (const item of items) {
      const id = item.data.id;
      const reason = this.rejectIds.get(id);
      let ack: Ack;
      if (reason) ack = { id, status: "rejected", reason };
      else if (this.log.some((l) => l.item.data.id === id)) ack = { id, status: "duplicate" };
      else {
        this.log.push({ seq: this.log.length + 1, item });
        ack = { id, status: "applied" };
      }
      if (!this.silentIds.has(id)) acks.push(ack);
    }
    return Response.json({ acks, serverSeq: this.log.length });
  }

  /** Cursors are "1.<seq>" (one transaction id for the whole log); "0" is the start. */
  private pull(params: URLSearchParams): Response {
    const raw = params.get("cursor") ?? "0";
    const cursor = Number(raw.includes(".") ? raw.split(".")[1] : raw);
    const limit = Math.min(this.pullPageSize, Number(params.get("limit") ?? Infinity));
    const after = this.log.filter((l) => l.seq > cursor && !this.forgotten(l.item));
    const page = after.slice(0, limit);
    const nextCursor = `1.${page.at(-1)?.seq ?? cursor}`;
    return Response.json({
      items: page.map((l) => ({ type: l.item.type, seq: l.seq, data: l.item.data })),
      nextCursor,
      hasMore: after.length > page.length,
      ...(params.get("total") === "1" ? { total: after.length } : {}),
      ...(raw === "0" && this.forget.length > 0 ? { forget: this.forget } : {}),
      ...(this.scope === undefined ? {} : { scope: this.scope }),
    });
  }

  /** What a real server would no longer show: the forgotten runs, their events, sessions left with none. */
  private forgotten(item: Item): boolean {
    if (this.forget.length === 0) return false;
    if (item.type === "run") return this.forget.includes(item.data.id);
    if (item.type === "event") return this.forget.includes(item.data.runId);
    const runs = this.log.filter((l) => l.item.type === "run" && l.item.data.sessionId === item.data.id);
    return runs.length > 0 && runs.every((l) => this.forget.includes(l.item.data.id));
  }

  eventIds(): string[] {
    return this.log.filter((l) => l.item.type === "event").map((l) => l.item.data.id);
  }
}
