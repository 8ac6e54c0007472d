import { afterAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { Client } from "pg";
import { v7 as uuidv7 } from "uuid";
import { applyPush } from "@/db/queries/sync-push";
import { pipelineTransaction } from "@/db/queries/sync-pipeline";
import { createSimUsers } from "./sync-sim";
import { db, getPool } from "./support/db";
import { deviceId, recorder, run, session, T0 } from "./sync-fixtures";

/** Round trips (pg Client.query calls) made while `work` runs. */
async function roundTrips<T>(work: () => Promise<T>): Promise<{ out: T; trips: number }> {
  const query = Client.prototype.query;
  let trips = 0;
  Client.prototype.query = function counted(this: Client, ...args: unknown[]) {
    trips += 1;
    return (query as (...a: unknown[]) => unknown).apply(this, args);
  } as typeof Client.prototype.query;
  try {
    return { out: await work(), trips };
  } finally {
    Client.prototype.query = query;
  }
}

/**
 * The pipelined push (db/queries/sync-push.ts pipelinedPush, db/queries/sync-pipeline.ts): statements sent
 * several to a message, with the careful way behind it.
 */
describe("pipelined push", () => {
  afterAll(async () => {
    await getPool().end();
  });

  it("stores a first push in 4 round trips, a push of events in 2 and a push that creates runs in 4, with the same acks and results", async () => {
    const [user] = await createSimUsers(db, 1);
    const phone = recorder(deviceId());
    const s = session(user!.id);
    const r1 = run(s.id, [{ lane: 0, pilotName: "Test pilot", pilotUserId: user!.id }]);
    const first = [phone.at(r1.id, T0, { kind: "window-start" }), ...phone.flights(r1.id, 0, [30], T0 + 1000)];
    // the first push (a session, a run, a new estimate): staged, 4 round trips (16 the careful way): the claim with the
    // session's owner read; the estimate's insert and the read of the stamps it moves, the session's insert, the account
    // key and the run's facts; the run's insert with the locks and the load; the last message
    const a = await roundTrips(() => applyPush(db, user!.id, { deviceId: phone.id, sessions: [s], runs: [r1], events: first }));
    expect(a.trips).toBe(4);
    expect(a.out.acks).toEqual([s, r1, ...first].map((x) => ({ id: x.id, status: "applied" })));

    const later = phone.flights(r1.id, 0, [40, 50], T0 + 60_000);
    const b = await roundTrips(() => applyPush(db, user!.id, { deviceId: phone.id, sessions: [], runs: [], events: later }));
    expect(b.trips).toBe(2);
    expect(b.out.acks).toEqual(later.map((e) => ({ id: e.id, status: "applied" })));

    const r2 = run(s.id, [{ lane: 0, pilotName: "Test pilot", pilotUserId: user!.id }]);
    const more = [phone.at(r2.id, T0 + 3_600_000, { kind: "window-start" }), ...phone.flights(r2.id, 0, [20], T0 + 3_601_000)];
    const c = await roundTrips(() => applyPush(db, user!.id, { deviceId: phone.id, sessions: [], runs: [r2], events: [...more, later[0]!] }));
    expect(c.trips).toBe(4);
    expect(c.out.acks).toEqual([{ id: r2.id, status: "applied" }, { id: later[0]!.id, status: "duplicate" }, ...more.map((e) => ({ id: e.id, status: "applied" }))]);

    const lanes = await db.execute<{ run_id: string; result_tenths: number }>(
      sql`select run_id::text, result_tenths from run_lanes where run_id in (${r1.id}::uuid, ${r2.id}::uuid) order by run_id`,
    );
    expect(lanes.rows).toEqual([{ run_id: r1.id, result_tenths: 1200 }, { run_id: r2.id, result_tenths: 200 }]);
    const seq = await db.execute<{ n: string }>(sql`select last_value::text as n from sync_seq`);
    expect(c.out.serverSeq).toBeLessThanOrEqual(Number(seq.rows[0]!.n));
    expect(c.out.serverSeq).toBeGreaterThan(b.out.serverSeq);
  });

  it("acks an event whose id another device's push stored meanwhile as refused, and stores it once (the careful way after the clash)", async () => {
    const [user, other] = await createSimUsers(db, 2);
    // each account's run, pushed the careful way first
    const mine = recorder(deviceId());
    const theirs = recorder(deviceId());
    const s1 = session(user!.id);
    const s2 = session(other!.id);
    const r1 = run(s1.id, [{ lane: 0, pilotName: "Test pilot" }]);
    const r2 = run(s2.id, [{ lane: 0, pilotName: "Test pilot" }]);
    await applyPush(db, user!.id, { deviceId: mine.id, sessions: [s1], runs: [r1], events: [mine.at(r1.id, T0, { kind: "window-start" })] });
    await applyPush(db, other!.id, { deviceId: theirs.id, sessions: [s2], runs: [r2], events: [theirs.at(r2.id, T0, { kind: "window-start" })] });

    // the same event id taken by the other device in a transaction that is still open while this push loads
    const id = uuidv7();
    const holder = await getPool().connect();
    try {
      await holder.query("begin");
      const clash = theirs.at(r2.id, T0 + 5000, { kind: "launch", lane: 0 });
      await holder.query(
        `insert into events (id, run_id, device_id, seq, recorded_by, kind, body, wall_ms, mono_ms, page_id, corrected_ms)
         values ($1, $2, $3, $4, $5, 'launch', '{"kind":"launch","lane":0}', $6, $6, 'p', $6)`,
        [id, r2.id, theirs.id, clash.seq, other!.id, T0 + 5000],
      );
      const event = { ...mine.at(r1.id, T0 + 5000, { kind: "launch", lane: 0 }), id };
      const pushing = applyPush(db, user!.id, { deviceId: mine.id, sessions: [], runs: [], events: [event] });
      // the push's plain insert now waits for the holder's row
      await waitFor(async () => (await db.execute<{ n: string }>(sql`select count(*)::text as n from pg_stat_activity where wait_event_type = 'Lock' and datname = current_database()`)).rows[0]!.n !== "0");
      await holder.query("commit");
      const reply = await pushing;
      expect(reply.acks).toEqual([{ id, status: "rejected", reason: "This event id is already used by another event." }]);
    } finally {
      holder.release();
    }
    const rows = await db.execute<{ run_id: string }>(sql`select run_id::text from events where id = ${id}::uuid`);
    expect(rows.rows).toEqual([{ run_id: r2.id }]);
    const refused = await db.execute<{ n: string }>(sql`select count(*)::text as n from sync_rejections where item_id = ${id} and device_id = ${mine.id}`);
    expect(refused.rows[0]!.n).toBe("1");
  });

  it("sends values with quotes, backslashes, dollars and other characters as literals that read back the same", async () => {
    const texts = ["it's", "back\\slash", "both \\' and '\\", "$1 and $2", '"quoted", {braced}', "ü ✓ 😀", "", "NULL", "line\nbreak"];
    const rows = await pipelineTransaction(db, async ({ send }) => {
      const [one, two] = await send([
        sql`select ${texts[0]}::text as a, ${texts[1]}::text as b, ${texts[2]}::text as c, ${texts[3]}::text as d, ${texts[4]}::text as e,
          ${texts[5]}::text as f, ${texts[6]}::text as g, ${texts[7]}::text as h, ${texts[8]}::text as i, '$1' as j, ${null}::text as k`,
        sql`select ${sql.param(texts)}::text[] as arr, ${sql.param([1.5, null, -2])}::float8[] as nums, ${true}::boolean as yes, ${12}::int as n`,
      ], { commit: true });
      return [one!.rows[0], two!.rows[0]];
    });
    expect(rows[0]).toEqual({ a: texts[0], b: texts[1], c: texts[2], d: texts[3], e: texts[4], f: texts[5], g: texts[6], h: texts[7], i: texts[8], j: "$1", k: null });
    expect(rows[1]).toEqual({ arr: texts, nums: [1.5, null, -2], yes: true, n: 12 });
  });
});

async function waitFor(check: () => Promise<boolean>, ms = 5000): Promise<void> {
  const end = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > end) throw new Error("timed out waiting");
    await new Promise((r) => setTimeout(r, 20));
  }
}
