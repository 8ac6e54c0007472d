import { sql } from "drizzle-orm";
import { Client } from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { getDayBoard } from "@/db/queries/club-day-board";
import { closeClubDay, openClubDay } from "@/db/queries/club-days";
import { applyPush } from "@/db/queries/sync-push";
import type { Database } from "@/db";
import { clubFields, clubs, memberships } from "@/db/schema";
import { getCatalogueTask } from "@/lib/tasks";
import { db, freshUser, getPool } from "./support/db";
import { settledOrWaiting } from "./support/day-locks";
import { deviceId, recorder, run, session } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

/**
 * Closing a day keeps the runs that belong to it then (club_day_closed_runs, freezeDayRuns). A push
 * and a close on two connections at the same instant must agree on an order: a push that committed
 * first is in the closed day, a push that commits after the close is not (and does not fail). Without
 * a lock, a close could read while a push of a run at the day's field was written but not committed,
 * keep a list without it, and the push then commit: a run synced before the close was over, missing.
 * Each case holds one side's real transaction open (on its own pooled connection) after all its work,
 * until the other side is seen waiting for a lock or has finished.
 */

type Held = { db: Database; worked: Promise<void>; release: () => void };

/**
 * `db` whose transactions do all their work, then wait for `release()` before committing. A pipelined push
 * (db/queries/sync-pipeline.ts) sends its last statements and `commit` in one message: that message waits instead
 * when `pipelined` (its run written, its club days held; its events' insert and store go with the commit).
 */
function holdBeforeCommit(pipelined = false): Held {
  let release!: () => void;
  let worked!: () => void;
  const gate = new Promise<void>((r) => (release = r));
  const done = new Promise<void>((r) => (worked = r));
  const query = Client.prototype.query;
  if (pipelined) Client.prototype.query = function held(this: Client, ...args: unknown[]) {
    const send = () => (query as (...a: unknown[]) => unknown).apply(this, args);
    if (typeof args[0] !== "string" || !args[0].endsWith(";\ncommit")) return send();
    Client.prototype.query = query; // one push's message only
    worked();
    return gate.then(send);
  } as typeof Client.prototype.query;
  void gate.then(() => (Client.prototype.query = query));
  const held = new Proxy(db, {
    get(target, key, receiver) {
      if (key !== "transaction") return Reflect.get(target, key, receiver);
      return (fn: (tx: unknown) => Promise<unknown>, config?: unknown) =>
        (target.transaction as (f: typeof fn, c?: unknown) => Promise<unknown>)(async (tx) => {
          const out = await fn(tx);
          worked();
          await gate;
          return out;
        }, config);
    },
  });
  return { db: held, worked: done, release };
}

/** An officer's club with a day open at "Race Meadow" on `day`, and a push of one run flown there at 10:00 UTC. */
async function setUp(day: string) {
  const officer = await freshUser("close-race");
  const [club] = await db.insert(clubs).values({ name: "Race Club", slug: `race-club-${Date.now()}-${Math.random().toString(36).slice(2, 6)}` }).returning();
  await db.insert(memberships).values({ clubId: club!.id, userId: officer.id, role: "officer" });
  const [field] = await db.insert(clubFields).values({ clubId: club!.id, name: "Race Meadow" }).returning();
  const opened = await openClubDay(db, { clubId: club!.id, fieldId: field!.id, day, userId: officer.id });
  if (!opened || opened === "closed") throw new Error("the day did not open");
  const startMs = Date.parse(`${day}T10:00:00Z`);
  const phone = recorder(deviceId(), { estimate: { thetaMs: 0, deltaMs: 20, measuredAtWallMs: startMs - 60_000 } });
  const s = { ...session(officer.id, { fieldName: "Race Meadow" }), startedAtWallMs: startMs - 120_000 };
  const r = { ...run(s.id, [{ lane: 0, pilotName: officer.name, pilotUserId: officer.id }], getCatalogueTask("H")), createdAtWallMs: startMs - 60_000 };
  const events = [phone.at(r.id, startMs, { kind: "window-start" }), ...phone.flights(r.id, 0, [45], startMs + 5_000)];
  const push = (on: Database) => applyPush(on, officer.id, { deviceId: phone.id, sessions: [s], runs: [r], events });
  const kept = async () =>
    (await db.execute<{ run_id: string }>(sql`select k.run_id from club_day_closed_runs k join club_days d on d.id = k.day_id where d.club_id = ${club!.id}`)).rows.map((x) => x.run_id);
  return { officer, clubId: club!.id, runId: r.id, push, kept };
}

describe("closing a day while a phone syncs (two connections)", () => {
  it("a push written before the close commits is in the closed day: the close waits for it", async () => {
    const day = "2026-07-04";
    const t = await setUp(day);
    const pushing = holdBeforeCommit(true);
    const pushed = t.push(pushing.db);
    await pushing.worked; // the run and its events are written, not committed
    const closing = closeClubDay(db, { clubId: t.clubId, day, userId: t.officer.id });
    expect(await settledOrWaiting(closing)).toBe("waiting"); // for the push to commit
    pushing.release();
    const reply = await pushed;
    expect(reply.acks.filter((a) => a.id === t.runId).map((a) => a.status)).toEqual(["applied"]);
    expect(await closing).not.toBeNull();
    expect(await t.kept()).toEqual([t.runId]);
    expect((await getDayBoard(db, { clubId: t.clubId, day }))!.runs.map((r) => r.runId)).toEqual([t.runId]);
  });

  it("a push that reaches the day while the close is being written waits, then commits outside it", async () => {
    const day = "2026-07-05";
    const t = await setUp(day);
    const closingTx = holdBeforeCommit();
    const closing = closeClubDay(closingTx.db, { clubId: t.clubId, day, userId: t.officer.id });
    await closingTx.worked; // the close is written (an empty list), not committed
    const pushed = t.push(db);
    expect(await settledOrWaiting(pushed)).toBe("waiting"); // for the close to commit
    closingTx.release();
    expect(await closing).not.toBeNull();
    const reply = await pushed;
    expect(reply.acks.filter((a) => a.id === t.runId).map((a) => a.status)).toEqual(["applied"]);
    expect(await t.kept()).toEqual([]);
    expect((await getDayBoard(db, { clubId: t.clubId, day }))!.runs).toEqual([]);
  });
});
