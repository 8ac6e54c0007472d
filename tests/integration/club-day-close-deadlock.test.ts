import { sql } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { closeClubDay, openClubDay } from "@/db/queries/club-days";
import { applyPush } from "@/db/queries/sync-push";
import { deriveAndStoreRuns } from "@/db/queries/runs";
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
 * The lock order of a push against a day's close (db/queries/club-day-locks.ts). The close takes its
 * day rows FOR UPDATE, then keeps the day's runs (club_day_closed_runs: each insert takes the run's key
 * FOR KEY SHARE). A push that deletes an unstarted window (applyDiscards: the run's row FOR UPDATE, then
 * deleted) and stores other runs at the same field used to take the day's share lock only when it stored
 * the results, after the delete: the push held the run and waited for the day, the close held the day
 * and waited for the run, and PostgreSQL cancelled one of them (deadlock detected). Here the close is
 * held open on its own connection right after it has locked its day rows; the push starts; then the
 * close goes on. Both must finish.
 */

/** `db` whose transactions pause after their first statement until `release()`. */
function pauseAfterFirstStatement(): { db: Database; locked: Promise<void>; release: () => void } {
  let release!: () => void;
  let locked!: () => void;
  const gate = new Promise<void>((r) => (release = r));
  const first = new Promise<void>((r) => (locked = r));
  const held = new Proxy(db, {
    get(target, key, receiver) {
      if (key !== "transaction") return Reflect.get(target, key, receiver);
      return (fn: (tx: unknown) => Promise<unknown>, config?: unknown) =>
        (target.transaction as (f: typeof fn, c?: unknown) => Promise<unknown>)(async (tx) => {
          let calls = 0;
          const paused = new Proxy(tx as object, {
            get(t, k, r) {
              const v = Reflect.get(t, k, r) as unknown;
              if (k !== "execute" || typeof v !== "function") return v;
              return async (...args: unknown[]) => {
                const out = await (v as (...a: unknown[]) => Promise<unknown>).apply(t, args);
                if (++calls === 1) {
                  locked();
                  await gate;
                }
                return out;
              };
            },
          });
          return fn(paused);
        }, config);
    },
  });
  return { db: held, locked: first, release };
}

/** Whether another connection could take the run's row lock right now ("free"), or who holds it. */
async function runLockFree(runId: string): Promise<string> {
  const probe = await getPool().connect();
  try {
    await probe.query("begin");
    return await probe.query("select id from runs where id = $1 for no key update nowait", [runId]).then(
      () => "free",
      (e: { message?: string }) => `held: ${e.message}`,
    );
  } finally {
    await probe.query("rollback");
    probe.release();
  }
}

/** A club with an officer and one field, its day opened; a phone with a clock estimate and a session at that field. */
async function openDayAtField(day: string, name: string) {
  const officer = await freshUser(`close-${name}`);
  const [made] = await db.insert(clubs).values({ name: `${name} Club`, slug: `${name.toLowerCase()}-club-${Date.now()}-${Math.random().toString(36).slice(2, 6)}` }).returning();
  const club = made!;
  await db.insert(memberships).values({ clubId: club.id, userId: officer.id, role: "officer" });
  const [field] = await db.insert(clubFields).values({ clubId: club.id, name: `${name} Meadow` }).returning();
  const opened = await openClubDay(db, { clubId: club.id, fieldId: field!.id, day, userId: officer.id });
  if (!opened || opened === "closed") throw new Error("the day did not open");
  const startMs = Date.parse(`${day}T10:00:00Z`);
  const phone = recorder(deviceId(), { estimate: { thetaMs: 0, deltaMs: 20, measuredAtWallMs: startMs - 60_000 } });
  const s = { ...session(officer.id, { fieldName: `${name} Meadow` }), startedAtWallMs: startMs - 120_000 };
  const lanes = [{ lane: 0, pilotName: officer.name, pilotUserId: officer.id }];
  return { officer, club, startMs, phone, s, lanes };
}

describe("closing a day while a phone deletes a window and stores a run there (two connections)", () => {
  it("takes the day before the runs, as the close does: no deadlock, both finish", async () => {
    const day = "2026-07-11";
    const { officer, club, startMs, phone, s, lanes } = await openDayAtField(day, "Lock");
    // a window set up at the field that day and synced, never started: it belongs to the day (set-up time)
    const unstarted = { ...run(s.id, lanes, getCatalogueTask("H")), createdAtWallMs: startMs - 90_000 };
    const first = await applyPush(db, officer.id, { deviceId: phone.id, sessions: [s], runs: [unstarted], events: [] });
    expect(first.acks.map((a) => a.status)).toEqual(["applied", "applied"]);
    // the next push deletes it and brings a flown run at the same field
    const flown = { ...run(s.id, lanes, getCatalogueTask("H")), createdAtWallMs: startMs - 60_000 };
    const events = [phone.at(flown.id, startMs, { kind: "window-start" }), ...phone.flights(flown.id, 0, [45], startMs + 5_000)];

    const closingTx = pauseAfterFirstStatement();
    const closing = closeClubDay(closingTx.db, { clubId: club.id, day, userId: officer.id });
    await closingTx.locked; // the close holds its day row FOR UPDATE, not yet its runs
    const pushed = applyPush(db, officer.id, { deviceId: phone.id, sessions: [], runs: [flown], events, discards: [{ id: unstarted.id }] });
    expect(await settledOrWaiting(pushed)).toBe("waiting"); // for the day
    closingTx.release();

    const [closed, reply] = await Promise.allSettled([closing, pushed]);
    // a failed query's cause is the database's error (before the fix: "deadlock detected" on one side)
    const why = (r: PromiseSettledResult<unknown>, ok: string) =>
      r.status === "fulfilled" ? ok : String((r.reason as { cause?: { message?: string } }).cause?.message ?? r.reason);
    expect(why(closed, "closed")).toBe("closed");
    expect(why(reply, "pushed")).toBe("pushed");
    const acks = (reply as PromiseFulfilledResult<Awaited<typeof pushed>>).value.acks;
    expect(acks.filter((a) => a.id === unstarted.id || a.id === flown.id).map((a) => [a.id, a.status])).toEqual([
      [flown.id, "applied"],
      [unstarted.id, "applied"],
    ]);
    // the close kept the window (it belonged then); its deletion took it out with it; the flown run came after the close
    const kept = await db.execute<{ run_id: string }>(sql`
      select k.run_id from club_day_closed_runs k join club_days d on d.id = k.day_id where d.club_id = ${club.id}`);
    expect(kept.rows).toEqual([]);
    const left = await db.execute<{ id: string }>(sql`select id from runs where id in (${unstarted.id}::uuid, ${flown.id}::uuid)`);
    expect(left.rows.map((r) => r.id)).toEqual([flown.id]);
  }, 30_000);

  it("a push of events into a run at the day's field waits for the day before it locks the run (the close's order)", async () => {
    const day = "2026-07-12";
    const { officer, club, startMs, phone, s, lanes } = await openDayAtField(day, "Order");
    const flown = { ...run(s.id, lanes, getCatalogueTask("H")), createdAtWallMs: startMs - 60_000 };
    const first = await applyPush(db, officer.id, { deviceId: phone.id, sessions: [s], runs: [flown], events: [phone.at(flown.id, startMs, { kind: "window-start" })] });
    expect(first.acks.every((a) => a.status === "applied")).toBe(true);

    const closingTx = pauseAfterFirstStatement();
    const closing = closeClubDay(closingTx.db, { clubId: club.id, day, userId: officer.id });
    await closingTx.locked; // the close holds its day row FOR UPDATE, not yet its runs
    const pushed = applyPush(db, officer.id, { deviceId: phone.id, sessions: [], runs: [], events: phone.flights(flown.id, 0, [45], startMs + 5_000) });
    expect(await settledOrWaiting(pushed)).toBe("waiting"); // for the day
    // while it waits for the day, the push must not hold the run it writes: the close will take that run's key next
    // (with the order swapped, the push would hold the run FOR NO KEY UPDATE here and this NOWAIT would fail)
    const runFree = await runLockFree(flown.id);
    closingTx.release();
    const [closed, reply] = await Promise.allSettled([closing, pushed]);
    expect(runFree).toBe("free");
    expect(closed.status).toBe("fulfilled");
    expect(reply.status).toBe("fulfilled");
    // the close kept the run; the push's events arrived after it (the day's result stays as closed)
    const kept = await db.execute<{ run_id: string }>(sql`
      select k.run_id from club_day_closed_runs k join club_days d on d.id = k.day_id where d.club_id = ${club.id}`);
    expect(kept.rows.map((r) => r.run_id)).toEqual([flown.id]);
  }, 30_000);

  it("a re-derivation outside a push (deriveAndStoreRuns, as an officer's set-aside calls it) also waits for the day before it locks the run", async () => {
    const day = "2026-07-19";
    const { officer, club, startMs, phone, s, lanes } = await openDayAtField(day, "Derive");
    const flown = { ...run(s.id, lanes, getCatalogueTask("H")), createdAtWallMs: startMs - 60_000 };
    const first = await applyPush(db, officer.id, {
      deviceId: phone.id, sessions: [s], runs: [flown], events: [phone.at(flown.id, startMs, { kind: "window-start" }), ...phone.flights(flown.id, 0, [45], startMs + 5_000)],
    });
    expect(first.acks.every((a) => a.status === "applied")).toBe(true);

    const closingTx = pauseAfterFirstStatement();
    const closing = closeClubDay(closingTx.db, { clubId: club.id, day, userId: officer.id });
    await closingTx.locked;
    const derived = db.transaction((tx) => deriveAndStoreRuns(tx, [flown.id]));
    expect(await settledOrWaiting(derived)).toBe("waiting");
    const runFree = await runLockFree(flown.id); // with the runs locked first: "held: could not obtain lock…"
    closingTx.release();
    const [closed, rederived] = await Promise.allSettled([closing, derived]);
    expect(runFree).toBe("free");
    expect(closed.status).toBe("fulfilled");
    expect(rederived.status).toBe("fulfilled");
  }, 30_000);
});
