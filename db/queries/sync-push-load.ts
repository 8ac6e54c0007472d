import "server-only";
import { sql, type SQL } from "drizzle-orm";
import { storedOffset, type ClockEstimate } from "@/lib/clock";
import type { EventBody } from "@/lib/events/schema";
import type { DerivationEvent } from "@/lib/sync/derive";
import { uncertaintyOf } from "@/lib/sync/correct-events";
import { FOLD_VERSION, type RunFold } from "@/lib/results/fold-state";
import type { Tx } from "./sync-db";

/**
 * A run as a push checks and derives it: who created it, its task and lanes, how many events it
 * holds, its folded state (lib/results/fold-state.ts) when one of this FOLD_VERSION is stored, and
 * its stored events — read only when there is no such state (`events: null`: not read; the
 * derivation reads them if the state cannot take the new events, loadRunEvents).
 */
export type LoadedRun = {
  id: string;
  createdBy: string;
  task: unknown;
  lanes: { lane: number; pilotUserId: string | null }[];
  eventCount: number;
  fold: RunFold | null;
  events: DerivationEvent[] | null;
};

/** A stored event a pushed one may clash with (same id, or the pushing device's same seq), or amend. */
export type StoredEvent = { id: string; deviceId: string; seq: number; runId: string; recordedBy: string };

export type PushLoad = { runs: Map<string, LoadedRun>; stored: StoredEvent[]; estimates: Map<string, ClockEstimate[]> };

const ids = (list: readonly string[]) => (list.length ? sql.join(list.map((id) => sql`${id}::uuid`), sql`, `) : sql`null`);

/**
 * Everything a push reads before it writes, in ONE statement (one round trip, one snapshot),
 * after the runs were locked (lockRuns: the snapshot is taken after the locks are granted, so
 * it holds every event committed to them): each run's creator, task, lanes, event count and folded
 * state — and ALL its stored events when it has no folded state or `allEvents` asks for them (the
 * derivation's input: the push adds what it inserts, no second read), the
 * stored events the pushed ones may clash with or amend, and the clock estimates of every
 * device with events in these runs (and of the pushing device). The facts travel as JSON on one
 * row; the events as plain rows after it (building JSON of thousands of events costs the database
 * more than sending them as rows).
 */
export async function loadForPush(tx: Tx, p: LoadInput): Promise<PushLoad> {
  return readLoad((await tx.execute<LoadRow>(loadSql(p))).rows);
}

type LoadInput = { runIds: readonly string[]; eventIds: readonly string[]; deviceId: string; seqs: readonly number[]; allEvents?: boolean };
type LoadRow = EventRow & { f: boolean; runs: LoadedRunRow[] | null; stored: StoredEvent[] | null; estimates: [string, number, number, number][] | null };

/** loadForPush's statement. */
export function loadSql(p: LoadInput): SQL {
  const runList = ids(p.runIds);
  // the pushed ids and seqs (hundreds) as one array parameter each: building a `$n::uuid` fragment per item cost more JavaScript than the lookup
  const eventIds = sql.param(p.eventIds);
  const seqs = sql.param(p.seqs);
  // the facts ride on one extra row (f = true) before the events' own rows: one statement, one snapshot
  return sql`
    with facts as (select
      (select coalesce(json_agg(json_build_object('id', r.id, 'createdBy', r.created_by, 'task', r.task,
          'lanes', (select coalesce(json_agg(json_build_object('lane', l.lane, 'pilotUserId', l.pilot_user_id) order by l.lane), '[]')
                    from run_lanes l where l.run_id = r.id),
          'eventCount', (select count(*) from events e where e.run_id = r.id),
          'fold', ${p.allEvents ? sql`null` : sql`(select f.state from run_folds f where f.run_id = r.id and f.version = ${FOLD_VERSION})`})), '[]')
        from runs r where r.id in (${runList})) as runs,
      (select coalesce(json_agg(json_build_object('id', e.id, 'deviceId', e.device_id, 'seq', e.seq, 'runId', e.run_id, 'recordedBy', e.recorded_by)), '[]')
        from events e where e.id = any(${eventIds}::uuid[]) or (e.device_id = ${p.deviceId} and e.seq = any(${seqs}::int[]))) as stored,
      (select coalesce(json_agg(json_build_array(c.device_id, c.theta_ms, c.delta_ms, c.measured_at_wall_ms)), '[]')
        from device_clock_estimates c
        where c.device_id = ${p.deviceId} or c.device_id in (select distinct device_id from events where run_id in (${runList}))) as estimates)
    select true as f, f.runs, f.stored, f.estimates, null::text as id, null::text as run_id, null::text as device_id, null::int as seq,
      null::text as recorded_by, null::jsonb as body, null::float8 as wall_ms, null::float8 as mono_ms, null::text as page_id,
      null::float8 as offset_theta_ms, null::float8 as offset_delta_ms, null::float8 as offset_measured_at_ms, null::float8 as corrected_ms,
      null::float8 as uncertainty_ms
    from facts f
    union all
    select false, null, null, null, e.id::text, e.run_id::text, e.device_id, e.seq, e.recorded_by::text, e.body, e.wall_ms, e.mono_ms, e.page_id,
      e.offset_theta_ms, e.offset_delta_ms, e.offset_measured_at_ms, e.corrected_ms, e.uncertainty_ms
    from events e where e.run_id in (${runList})
      ${p.allEvents ? sql`` : sql`and not exists (select 1 from run_folds f where f.run_id = e.run_id and f.version = ${FOLD_VERSION})`}`;
}

/** loadForPush's answer from the rows of its statement. */
export function readLoad(rows: readonly LoadRow[]): PushLoad {
  const facts = rows.find((r) => r.f)!;
  const row = { runs: facts.runs ?? [], stored: facts.stored ?? [], estimates: facts.estimates ?? [] };
  const runs = new Map<string, LoadedRun>(row.runs.map((r) => [r.id, { ...r, events: r.fold ? null : [] }]));
  for (const e of rows) if (!e.f) runs.get(e.run_id)?.events?.push(fromRow(e));
  const estimates = new Map<string, ClockEstimate[]>();
  for (const [deviceId, thetaMs, deltaMs, measuredAtWallMs] of row.estimates) {
    const list = estimates.get(deviceId) ?? [];
    list.push({ thetaMs, deltaMs, measuredAtWallMs });
    estimates.set(deviceId, list);
  }
  return { runs, stored: row.stored, estimates };
}

type LoadedRunRow = Omit<LoadedRun, "events">;

/** Every stored event of these runs (a derivation in full after the folded state could not take a push's events). */
export async function loadRunEvents(tx: Tx, runIds: readonly string[]): Promise<Map<string, DerivationEvent[]>> {
  const out = new Map<string, DerivationEvent[]>(runIds.map((id) => [id, []]));
  if (runIds.length === 0) return out;
  const res = await tx.execute<EventRow>(sql`select e.id::text, e.run_id::text, e.device_id, e.seq, e.recorded_by::text, e.body, e.wall_ms, e.mono_ms, e.page_id,
      e.offset_theta_ms, e.offset_delta_ms, e.offset_measured_at_ms, e.corrected_ms, e.uncertainty_ms
    from events e where e.run_id in (${ids(runIds)})`);
  for (const e of res.rows) out.get(e.run_id)?.push(fromRow(e));
  return out;
}

type EventRow = {
  id: string; run_id: string; device_id: string; seq: number; recorded_by: string; body: EventBody; wall_ms: number; mono_ms: number; page_id: string;
  offset_theta_ms: number | null; offset_delta_ms: number | null; offset_measured_at_ms: number | null; corrected_ms: number; uncertainty_ms: number | null;
};

function fromRow(e: EventRow): DerivationEvent {
  const offset = storedOffset(e.offset_theta_ms, e.offset_delta_ms, e.offset_measured_at_ms);
  return {
    id: e.id, deviceId: e.device_id, seq: e.seq, recordedBy: e.recorded_by, body: e.body,
    stamp: { wallMs: e.wall_ms, monoMs: e.mono_ms, pageId: e.page_id, offset },
    correctedMs: e.corrected_ms,
    uncertaintyMs: uncertaintyOf(e.uncertainty_ms),
  };
}
