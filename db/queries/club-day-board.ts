import "server-only";
import { sql } from "drizzle-orm";
import type { ClockEstimate } from "@/lib/clock";
import { buildDayBoard, type BoardLaneInput, type DayBoardView } from "@/lib/days/board";
import { dayBounds, DAY_MS, matchDayRuns } from "@/lib/days/matching";
import type { Database } from "../index";
import { withDecisions } from "./club-day-decided";
import { maybeAtFieldSql } from "./club-day-locks";
import { isTurnaround } from "./season/turnaround";
import type { Tx } from "./sync-db";

type Db = Database | Tx;

export type { DayBoardView };

type LaneRow = {
  run_id: string; session_field: string; session_lat: number | null; session_lon: number | null; created_at: Date | string; created_by: string; task_code: string; chosen: boolean;
  lane: number; pilot_user_id: string; result_tenths: number | null; needs_review: boolean; derived: unknown;
  status: "accepted" | "pending" | null; ground: (number | null)[] | null;
};

/**
 * The lanes of every run that may belong to the club's day: runs whose session may have been at one
 * of the day's fields (its name, or its position near the field's: maybeAtFieldSql) and whose phone
 * put them within a day of it (matchDayRuns then keeps those whose
 * corrected start falls on the day), and runs a pilot chose for the day. Once the day is closed
 * (`frozen`), the runs the close kept (club_day_closed_runs) and no others, each as if chosen.
 * Only runs set up by a member, only lanes flown by a member whose account is enabled, and never a
 * lane its pilot disputed or hid (lib/sync/consent.ts): own, accepted and pending lanes show.
 */
async function candidateLanes(db: Db, params: { clubId: string; day: string; timeZone: string; frozen: boolean }): Promise<LaneRow[]> {
  const { startMs, endMs } = dayBounds(params.day, params.timeZone);
  const from = new Date(startMs - DAY_MS).toISOString();
  const to = new Date(endMs + DAY_MS).toISOString();
  const res = await db.execute<LaneRow>(sql`
    with d as (select id, field_id from club_days where club_id = ${params.clubId} and day = ${params.day}::date),
    dayf as (select f.name, f.latitude, f.longitude from club_fields f join d on d.field_id = f.id),
    chosen as (
      select distinct cr.run_id from club_day_runs cr join d on d.id = cr.day_id where not ${params.frozen}
      union select k.run_id from club_day_closed_runs k join d on d.id = k.day_id where ${params.frozen}
    ),
    cand as (
      select r.id from runs r join field_sessions s on s.id = r.session_id
      where not ${params.frozen} and r.created_at >= ${from}::timestamptz and r.created_at < ${to}::timestamptz
        and exists (select 1 from dayf f where ${maybeAtFieldSql("s", "f")})
      union select run_id from chosen
    )
    select r.id as run_id, s.field_name as session_field, s.latitude as session_lat, s.longitude as session_lon, r.created_at, r.created_by, r.task_code,
      (ch.run_id is not null) as chosen, l.lane, l.pilot_user_id, l.result_tenths, l.needs_review, l.derived,
      case when r.created_by = l.pilot_user_id then null else coalesce(c.status::text, 'pending') end as status,
      (select array_agg(case when ${isTurnaround(sql`lf.ground_ms`, sql`r.flights_on_signal`)} then lf.ground_ms end order by lf.position)
        from lane_flights lf where lf.run_id = l.run_id and lf.lane = l.lane) as ground
    from cand
    join runs r on r.id = cand.id
    join field_sessions s on s.id = r.session_id
    join memberships mc on mc.club_id = ${params.clubId} and mc.user_id = r.created_by
    join run_lanes l on l.run_id = r.id
    join memberships mp on mp.club_id = ${params.clubId} and mp.user_id = l.pilot_user_id
    join users u on u.id = l.pilot_user_id and u.disabled_at is null
    left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
    left join chosen ch on ch.run_id = r.id
    where r.created_by = l.pilot_user_id or c.status is null or c.status = 'accepted'
    order by r.id, l.lane`);
  return res.rows;
}

/** A uuid[] literal of bound parameters (never empty: an empty list gives an empty typed array). */
const uuids = (ids: readonly string[]) =>
  ids.length === 0 ? sql`array[]::uuid[]` : sql`array[${sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)}]`;

type DeviceRow = { id: string; user_id: string; first_wall: number | null; estimates: ClockEstimate[] };

/** The phones that recorded the day's lanes (members' only), with every clock estimate each one stored. */
async function dayDevices(db: Db, params: { clubId: string; deviceIds: string[]; runIds: string[] }): Promise<DeviceRow[]> {
  if (params.deviceIds.length === 0) return [];
  const res = await db.execute<DeviceRow>(sql`
    select d.id, d.user_id,
      (select min(e.wall_ms) from events e where e.device_id = d.id and e.run_id = any(${uuids(params.runIds)})) as first_wall,
      coalesce((select json_agg(json_build_object('thetaMs', x.theta_ms, 'deltaMs', x.delta_ms, 'measuredAtWallMs', x.measured_at_wall_ms))
        from device_clock_estimates x where x.device_id = d.id), '[]'::json) as estimates
    from devices d join memberships m on m.user_id = d.user_id and m.club_id = ${params.clubId}
    where d.id = any(array[${sql.join(params.deviceIds.map((id) => sql`${id}::text`), sql`, `)}])
    order by d.id`);
  return res.rows;
}

type DayRow = { id: string; field_id: string; name: string; latitude: number | null; longitude: number | null; closed_at: Date | string | null; closed_by: string | null; frozen: boolean };

/** The club's day rows of a date (each at one field), with whether the close kept its runs. */
async function dayRows(db: Db, params: { clubId: string; day: string }): Promise<DayRow[]> {
  const res = await db.execute<DayRow>(sql`
    select d.id, d.field_id, f.name, f.latitude, f.longitude, d.closed_at, d.closed_by,
      (d.closed_at is not null and d.runs_frozen_at is not null) as frozen
    from club_days d join club_fields f on f.id = d.field_id
    where d.club_id = ${params.clubId} and d.day = ${params.day}::date order by f.name`);
  return res.rows;
}

async function clubTimeZone(db: Db, clubId: string): Promise<string> {
  const res = await db.execute<{ time_zone: string }>(sql`select time_zone from clubs where id = ${clubId}`);
  return res.rows[0]?.time_zone ?? "UTC";
}

/** The lanes that belong to the day, each with its run's corrected start (matchDayRuns on the club's clock). */
async function dayLanes(db: Db, params: { clubId: string; day: string; timeZone: string; days: DayRow[] }): Promise<BoardLaneInput[]> {
  const frozen = params.days.some((d) => d.frozen);
  const fields = params.days.map((d) => ({ name: d.name, position: d.latitude === null || d.longitude === null ? null : { latitude: d.latitude, longitude: d.longitude } }));
  const rows = await candidateLanes(db, { ...params, frozen });
  const byRun = new Map<string, LaneRow[]>();
  for (const r of rows) byRun.set(r.run_id, [...(byRun.get(r.run_id) ?? []), r]);
  const matched = matchDayRuns(
    [...byRun.entries()].map(([runId, lanes]) => ({
      runId, sessionField: lanes[0]!.session_field,
      sessionPosition: lanes[0]!.session_lat === null || lanes[0]!.session_lon === null ? null : { latitude: lanes[0]!.session_lat, longitude: lanes[0]!.session_lon },
      createdAtMs: new Date(lanes[0]!.created_at).getTime(), chosen: frozen || lanes[0]!.chosen,
      laneDerived: lanes.map((l) => l.derived), lanes,
    })),
    params.day,
    fields,
    params.timeZone,
  );
  return matched.flatMap((m) =>
    m.lanes.map((l) => ({
      runId: m.runId, startMs: m.startMs, fieldName: m.field ?? l.session_field,
      taskCode: l.task_code, createdBy: l.created_by, lane: l.lane, pilotId: l.pilot_user_id,
      consent: l.status ?? "own", resultTenths: l.result_tenths, needsReview: l.needs_review, derived: l.derived, groundMs: l.ground ?? [],
    })),
  );
}

/**
 * Keeps the runs that belong to the day now as its runs for good (club_day_closed_runs, one row per
 * day row of the date): called by the close, in its transaction, on days it closes. Returns how many runs.
 */
export async function freezeDayRuns(tx: Tx, params: { clubId: string; day: string }): Promise<number> {
  const days = (await dayRows(tx, params)).map((d) => ({ ...d, frozen: false }));
  if (days.length === 0) return 0;
  const lanes = await dayLanes(tx, { ...params, timeZone: await clubTimeZone(tx, params.clubId), days });
  const runIds = [...new Set(lanes.map((l) => l.runId))];
  if (runIds.length > 0) {
    await tx.execute(sql`
      insert into club_day_closed_runs (day_id, run_id)
      select d.id, r from unnest(${uuids(days.map((d) => d.id))}) d(id) cross join unnest(${uuids(runIds)}) r
      on conflict do nothing`);
  }
  await tx.execute(sql`update club_days set runs_frozen_at = coalesce(runs_frozen_at, now()) where id = any(${uuids(days.map((d) => d.id))})`);
  return runIds.length;
}

type DecisionRow = { run_id: string; lane: number; device_id: string | null; note: string; decided_by: string | null; decided_at: Date | string };

/** The Day board of a club's date, or null when no day is open at any of its fields on that date. */
export async function getDayBoard(db: Database, params: { clubId: string; day: string }): Promise<DayBoardView | null> {
  const days = await dayRows(db, params);
  if (days.length === 0) return null;
  const fields = days.map((r) => ({ id: r.field_id, name: r.name }));
  const timeZone = await clubTimeZone(db, params.clubId);
  const stored = await dayLanes(db, { ...params, timeZone, days });
  const runIds = [...new Set(stored.map((l) => l.runId))];
  const decisions = await db.execute<DecisionRow>(sql`
    select run_id, lane, device_id, note, decided_by, decided_at from club_day_decisions
    where club_id = ${params.clubId} and day = ${params.day}::date and run_id = any(${uuids(runIds)})`);
  // the officer's decisions: the record each names stands in the board's results, leaders and lift
  const lanes = await withDecisions(db, stored, decisions.rows);

  const deviceIds = new Set<string>();
  for (const l of lanes) {
    for (const v of (l.derived as { versions?: { deviceId?: unknown }[] } | null)?.versions ?? []) if (typeof v.deviceId === "string") deviceIds.add(v.deviceId);
  }
  const devices = await dayDevices(db, { clubId: params.clubId, deviceIds: [...deviceIds], runIds });
  const board = buildDayBoard(
    lanes,
    devices.flatMap((d) => (d.first_wall === null ? [] : [{ deviceId: d.id, ownerId: d.user_id, firstWallMs: Number(d.first_wall), estimates: d.estimates }])),
    dayBounds(params.day, timeZone),
  );

  const decisionOf = new Map(decisions.rows.map((r) => [`${r.run_id}:${r.lane}`, r]));
  const disagreements = board.disagreements.map((d) => {
    const r = decisionOf.get(`${d.runId}:${d.lane}`);
    return { ...d, decision: r ? { deviceId: r.device_id, note: r.note, decidedBy: r.decided_by, decidedAt: new Date(r.decided_at).toISOString() } : null };
  });

  const closed = days.find((r) => r.closed_at !== null) ?? null;
  const ids = new Set<string>([
    ...lanes.flatMap((l) => [l.pilotId, l.createdBy]),
    ...board.runs.flatMap((r) => r.lanes.map((l) => l.timedBy)),
    ...devices.map((d) => d.user_id),
    ...decisions.rows.flatMap((r) => (r.decided_by ? [r.decided_by] : [])),
    ...(closed?.closed_by ? [closed.closed_by] : []),
  ]);
  const people = await db.execute<{ id: string; name: string }>(sql`
    select u.id, u.name from users u join memberships m on m.user_id = u.id and m.club_id = ${params.clubId}
    where u.id = any(${uuids([...ids])})`);
  return {
    ...board,
    disagreements,
    day: params.day,
    timeZone,
    fields,
    closedAt: closed === null ? null : new Date(closed.closed_at!).toISOString(),
    closedBy: closed?.closed_by ?? null,
    people: Object.fromEntries(people.rows.map((p) => [p.id, p.name])),
  };
}
