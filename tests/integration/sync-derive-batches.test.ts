import "./support/session";
import { asc, eq, inArray, sql } from "drizzle-orm";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { applyPush } from "@/db/queries/sync-push";
import type { DeriveStats } from "@/db/queries/runs";
import { FOLD_LATER_EVENTS, listDeviceEstimates, toDerivationEvent } from "@/db/queries/runs";
import { events, runFolds, runLanes, runs } from "@/db/schema";
import type { EventBody, RunEvent } from "@/lib/events/schema";
import { runResult } from "@/lib/results";
import { getCatalogueTask, parseTaskDefinition, type TaskLetter } from "@/lib/tasks";
import { db, getPool } from "./support/db";
import { laneAggregatesBeside } from "./support/season-lane-aggregates";
import { weekTurnaroundsBeside } from "./support/season-week-turnarounds";
import { createSimUsers } from "./sync-sim";
import { deviceId, recorder, run, session, T0 } from "./sync-fixtures";

afterAll(async () => {
  await getPool().end();
});

/**
 * A push derives each run it touches once, from what it loaded after locking the run plus the
 * events it inserted (db/queries/sync-push.ts), never by reading the run back. Over random event
 * sequences from two phones (clocks apart, undos, corrections, penalties, both lanes) pushed in
 * random batches, some resent whole (duplicates), what each push stores must equal lib/results
 * runResult over every stored event read from scratch, after every push — whether the push derived
 * the run from its folded state (run_folds) or in full; both happen.
 */
type Step = { phone: 0 | 1; kind: "window-start" | "launch" | "landing" | "void" | "correct" | "penalty" | "run-end"; lane: 0 | 1; gapMs: number; pick: number };

const stepArb: fc.Arbitrary<Step> = fc.record({
  phone: fc.constantFrom(0 as const, 1 as const),
  kind: fc.constantFrom("window-start", "launch", "launch", "landing", "landing", "void", "correct", "penalty", "run-end"),
  lane: fc.constantFrom(0 as const, 1 as const),
  gapMs: fc.integer({ min: 0, max: 90_000 }),
  pick: fc.nat(),
});

const RUNS = Number(process.env.SYNC_DERIVE_RUNS ?? 25);
const SEED = Number(process.env.SYNC_DERIVE_SEED ?? 20261204);

async function fromScratch(runId: string) {
  const [r] = await db.select().from(runs).where(eq(runs.id, runId));
  const lanes = await db.select().from(runLanes).where(eq(runLanes.runId, runId)).orderBy(asc(runLanes.lane));
  const rows = await db.select().from(events).where(eq(events.runId, runId));
  const estimates = await listDeviceEstimates(db as never, [...new Set(rows.map((e) => e.deviceId))]);
  return runResult({
    task: parseTaskDefinition(r!.task),
    createdBy: r!.createdBy,
    lanes: lanes.map((l) => ({ lane: l.lane, pilotUserId: l.pilotUserId })),
    officials: new Set(),
    events: rows.map(toDerivationEvent).sort((a, b) => (a.id < b.id ? -1 : 1)),
    estimatesByDevice: estimates,
  }).lanes;
}

/**
 * Each lane's lane_flights rows and Season arrays as stored beside the same values computed in SQL
 * straight from the stored JSON (lane_flights_rows_at of migration 0027 over every position; the
 * expressions of migration 0039 over one expansion of the flights; the per-lane aggregates of migration
 * "season-lane-bins" against the lane_flights rows), so whatever keeps them (today a
 * trigger and generated columns) is checked against the derivation after every push.
 */
async function flightsBesideJson(runId: string) {
  const aggregates = laneAggregatesBeside(sql`l`);
  const res = await db.execute<{ lane: number; rows: unknown; rowsFromJson: unknown; arrays: unknown; arraysFromJson: unknown; aggregates: unknown; aggregatesFromRows: unknown }>(sql`
    select l.lane,
      (select coalesce(json_agg(json_build_array(f."position", f.flight_index, f.launch_ms, f.land_ms, f.status, f.time_tenths, f.credited_tenths, f.target_sec, f.ground_ms)
        order by f."position"), '[]') from lane_flights f where f.run_id = l.run_id and f.lane = l.lane) as rows,
      (select coalesce(json_agg(json_build_array(g."position", g.flight_index, g.launch_ms, g.land_ms, g.status, g.time_tenths, g.credited_tenths, g.target_sec, g.ground_ms)
        order by g."position"), '[]')
        from lane_flights_rows_at(l.derived -> 'flights', array(select generate_series(0, jsonb_array_length(l.derived -> 'flights') - 1))) g) as "rowsFromJson",
      json_build_array(l.season_ground_ms, l.season_landed_tenths, l.season_target_sec) as arrays,
      (select json_build_array(array_agg(x.ground order by x.p), array_agg(case when x.e ->> 'landMs' is not null then (x.e ->> 'timeTenths')::int end order by x.p),
          case when count(x.e ->> 'targetSec') > 0 then array_agg((x.e ->> 'targetSec')::int order by x.p) end)
        from (select t.p, t.e, (t.e ->> 'launchMs')::float8 - lag((t.e ->> 'landMs')::float8) over (order by t.p) as ground
          from jsonb_array_elements(l.derived -> 'flights') with ordinality as t(e, p)) x) as "arraysFromJson",
      ${aggregates.stored} as aggregates, ${aggregates.fromFlights} as "aggregatesFromRows"
    from run_lanes l where l.run_id = ${runId}::uuid order by l.lane`);
  return res.rows;
}

describe("derivation per push equals derivation from scratch (property)", () => {
  it(`over ${RUNS} random event sequences in random batches (seed ${SEED})`, async () => {
    const [ada] = await createSimUsers(db, 1);
    const stats: DeriveStats = { resumed: 0, full: 0, reasons: [] };
    await fc.assert(
      fc.asyncProperty(
        fc.array(stepArb, { minLength: 1, maxLength: 40 }),
        fc.array(fc.integer({ min: 1, max: 12 }), { minLength: 1, maxLength: 40 }),
        fc.constantFrom<TaskLetter>("H", "B", "J", "F", "A"),
        async (steps, batches, letter) => {
          const phones = [recorder(deviceId(), { thetaMs: 0 }), recorder(deviceId(), { thetaMs: -4_000 })];
          const s = session(ada!.id);
          const r = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada!.id }, { lane: 1, pilotName: "Guest" }], getCatalogueTask(letter));
          await applyPush(db, ada!.id, { deviceId: phones[0]!.id, sessions: [s], runs: [r], events: [] });
          const made: RunEvent[][] = [[], []];
          let t = T0;
          for (const step of steps) {
            t += step.gapMs;
            const mine = made[step.phone]!;
            const target = mine.length ? mine[step.pick % mine.length]! : null;
            let body: EventBody;
            if ((step.kind === "void" || step.kind === "correct") && target) {
              body = step.kind === "void" ? { kind: "void", targetId: target.id } : { kind: "correct", targetId: target.id, wallMs: target.stamp.wallMs - 1_500 };
            } else if (step.kind === "penalty") body = { kind: "penalty", lane: step.lane, points: 100, reason: "safety" };
            else if (step.kind === "window-start" || step.kind === "run-end") body = { kind: step.kind };
            else body = { kind: step.kind === "void" || step.kind === "correct" ? "launch" : step.kind, lane: step.lane };
            mine.push(phones[step.phone]!.at(r.id, t, body));
          }
          // each phone pushes its own events, in its own batches, the phones taking turns
          const queues = made.map((list) => [...list]);
          let b = 0;
          const sent: RunEvent[][][] = [[], []];
          while (queues.some((q) => q.length > 0)) {
            for (const [i, q] of queues.entries()) {
              const size = batches[b++ % batches.length]!;
              // every fifth push of a phone that sent before resends one of its batches first
              const again = size % 5 === 0 && sent[i]!.length > 0 ? sent[i]![size % sent[i]!.length]! : [];
              const batch = [...again, ...q.splice(0, size)];
              if (batch.length === 0) continue;
              sent[i]!.push(batch.slice(again.length));
              const reply = await applyPush(db, ada!.id, { deviceId: phones[i]!.id, sessions: [], runs: [], events: batch }, [], stats);
              expect(reply.acks.filter((a) => a.status !== "applied" && !(a.status === "duplicate" && again.some((e) => e.id === a.id)))).toEqual([]);
              const stored = await db.select().from(runLanes).where(inArray(runLanes.runId, [r.id])).orderBy(asc(runLanes.lane));
              const expected = await fromScratch(r.id);
              expect(stored.map((l) => ({ lane: l.lane, result: l.resultTenths, derived: l.derived, review: l.needsReview, reason: l.reviewReason }))).toEqual(
                expected.map((l) => ({ lane: l.lane, result: l.resultTenths, derived: JSON.parse(JSON.stringify(l.derived)), review: l.needsReview, reason: l.reviewReason })),
              );
              for (const l of await flightsBesideJson(r.id)) {
                expect([l.rows, l.arrays, l.aggregates], `lane ${l.lane}`).toEqual([l.rowsFromJson, l.arraysFromJson, l.aggregatesFromRows]);
              }
              // Ada's weekly turnarounds (season_week_turnarounds: marked stale by every push, settled as the Season reads them) follow every push
              const weeks = await weekTurnaroundsBeside([ada!.id]);
              expect(weeks.stored).toEqual(weeks.fromFlights);
            }
          }
        },
      ),
      { numRuns: RUNS, seed: SEED, endOnFailure: true },
    );
    expect(stats.resumed).toBeGreaterThan(0);
    expect(stats.full).toBeGreaterThan(0);
  }, 300_000);

  it("stores no folded state for a run's first few events: its next push folds one, the push after resumes from it", async () => {
    const [ada] = await createSimUsers(db, 1);
    const phone = recorder(deviceId());
    const s = session(ada!.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada!.id }]);
    const big = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada!.id }]);
    const flights = (runId: string, n: number, from: number) => phone.flights(runId, 0, Array.from({ length: n }, (_, i) => 20 + (i % 7)), from);
    const folded = async (runId: string) => (await db.select({ n: sql<number>`count(*)::int` }).from(runFolds).where(eq(runFolds.runId, runId)))[0]!.n;
    const storedBeside = async (runId: string) => {
      const stored = await db.select().from(runLanes).where(eq(runLanes.runId, runId)).orderBy(asc(runLanes.lane));
      expect(stored.map((l) => [l.resultTenths, l.derived])).toEqual((await fromScratch(runId)).map((l) => [l.resultTenths, JSON.parse(JSON.stringify(l.derived))]));
    };
    const pushed = async (events: RunEvent[], entities: boolean) => {
      const stats: DeriveStats = { resumed: 0, full: 0, reasons: [] };
      const reply = await applyPush(db, ada!.id, { deviceId: phone.id, sessions: entities ? [s] : [], runs: entities ? [r, big] : [], events }, [], stats);
      expect(reply.acks.every((a) => a.status === "applied")).toBe(true);
      return stats;
    };
    const bigEvents = flights(big.id, FOLD_LATER_EVENTS / 2 + 1, T0); // one flight more than FOLD_LATER_EVENTS events
    // the first push: both runs derived in full; only the run with more than FOLD_LATER_EVENTS events gets a state
    expect(await pushed([phone.at(r.id, T0, { kind: "window-start" }), ...flights(r.id, 10, T0 + 1_000), ...bigEvents], true)).toMatchObject({ resumed: 0, full: 2 });
    expect([await folded(r.id), await folded(big.id)]).toEqual([0, 1]);
    await storedBeside(r.id);
    // the next push reads the small run's events back (in the load), derives it in full and folds it; the big one resumes
    const t = T0 + 400_000;
    expect(await pushed([...flights(r.id, 3, t), ...flights(big.id, 1, t + 10_000_000)], false)).toMatchObject({ resumed: 1, full: 1 });
    expect(await folded(r.id)).toBe(1);
    await storedBeside(r.id);
    // and the one after resumes from it
    expect(await pushed(flights(r.id, 2, t + 100_000), false)).toMatchObject({ resumed: 1, full: 0 });
    await storedBeside(r.id);
    await storedBeside(big.id);
  });

  it("stores and resumes a derivation whose JSON is not ASCII: a device and page named with quotes, a backslash and emoji", async () => {
    // the lanes' derived and the folded state travel as UTF-8 bytes (db/queries/runs.ts jsonParam); the device id is in both
    const [ada] = await createSimUsers(db, 1);
    const phone = recorder(`phone \u00fc "q" \\ 🛩 ${deviceId()}`);
    const s = session(ada!.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada!.id }]);
    const stats: DeriveStats = { resumed: 0, full: 0, reasons: [] };
    const first = [phone.at(r.id, T0, { kind: "window-start" }), ...phone.flights(r.id, 0, [40, 50, 60], T0 + 5_000)];
    const second = phone.flights(r.id, 0, [70, 80], T0 + 600_000);
    const third = phone.flights(r.id, 0, [90], T0 + 900_000);
    for (const [i, batch] of [first, second, third].entries()) {
      const reply = await applyPush(db, ada!.id, { deviceId: phone.id, sessions: i === 0 ? [s] : [], runs: i === 0 ? [r] : [], events: batch }, [], stats);
      expect(reply.acks.every((a) => a.status === "applied")).toBe(true);
      const stored = await db.select().from(runLanes).where(eq(runLanes.runId, r.id)).orderBy(asc(runLanes.lane));
      const expected = await fromScratch(r.id);
      expect(stored.map((l) => l.derived)).toEqual(expected.map((l) => JSON.parse(JSON.stringify(l.derived))));
      expect(JSON.stringify(stored[0]!.derived)).toContain(JSON.stringify(phone.id));
    }
    // the second push folded a state (the first, of few events, stored none: FOLD_LATER_EVENTS) and the third resumed
    // it (read back from run_folds, not derived in full)
    expect([stats.full, stats.resumed]).toEqual([2, 1]);
  });

  it("stores each pushed event as sent: quotes, backslashes and emoji in a body, no clock estimate (nulls)", async () => {
    const [ada] = await createSimUsers(db, 1);
    const phone = recorder(deviceId(), { estimate: null });
    const s = session(ada!.id);
    const r = run(s.id, [{ lane: 0, pilotName: "Ada", pilotUserId: ada!.id }]);
    const reason = 'he said "no" \\ {not json} \u00fc 🛩 \n end';
    const sent = [phone.at(r.id, T0, { kind: "window-start" }), phone.at(r.id, T0 + 5, { kind: "penalty", lane: 0, points: 100, reason })];
    const reply = await applyPush(db, ada!.id, { deviceId: phone.id, sessions: [s], runs: [r], events: sent });
    expect(reply.acks.every((a) => a.status === "applied")).toBe(true);
    const rows = await db.select().from(events).where(eq(events.runId, r.id)).orderBy(asc(events.seq));
    expect(rows.map((e) => e.body)).toEqual(sent.map((e) => e.body));
    expect(rows.map((e) => [e.wallMs, e.monoMs, e.pageId, e.offsetThetaMs, e.offsetDeltaMs, e.offsetMeasuredAtMs, e.uncertaintyMs])).toEqual(
      sent.map((e) => [e.stamp.wallMs, e.stamp.monoMs, e.stamp.pageId, null, null, null, null]),
    );
  });
});
