import "server-only";
import { sql, type SQL } from "drizzle-orm";
import type { SeasonFilters } from "@/lib/validations/season";
import { launchAtMs, lanesNamingModel, modelAtSql } from "../flight-model";
import { flightsOnSignal, isTurnaround } from "./turnaround";

const DAY_MS = 24 * 3600 * 1000;
/**
 * Flight-duration histogram: 30-second bins of the landed flights' time, the last one open (300 s and longer).
 * run_lanes.season_duration_bins counts each lane's flights in the same bins (migration "season-lane-bins": keep both
 * in step; tests/integration/season-lane-arrays.test.ts compares them).
 */
export const DURATION_BIN_SEC = 30;
export const LAST_DURATION_BIN = 10;

/** The points-lost causes of the stored breakdown (lib/tasks/breakdown.ts), each a column of `season_lanes` (tenths). */
export const LOST_PARTS = ["groundTime", "overCap", "shortOfTarget", "invalid", "notCounted", "roundZero"] as const;
/** Where run_lanes keeps each cause, filled from the breakdown by PostgreSQL at every stored derivation (db/schema/sessions.ts). */
const LOST_COLUMNS: Record<(typeof LOST_PARTS)[number], string> = {
  groundTime: "season_lost_ground_time", overCap: "season_lost_over_cap", shortOfTarget: "season_lost_short_of_target",
  invalid: "season_lost_invalid", notCounted: "season_lost_not_counted", roundZero: "season_lost_round_zero",
};
const contest = sql`exists (select 1 from group_slots g where g.run_id = r.id)`;
/** The same, per lane in a select list: one hashed look-up of the drawn runs instead of a scan of the draw per lane. */
const contestColumn = sql`coalesce(r.id in (select g.run_id from group_slots g where g.run_id is not null), false)`;

/** No filter at all: the pilot's whole season (what the per-pilot tables kept for it, such as season_week_turnarounds, hold). */
export function isUnfiltered(f: SeasonFilters): boolean {
  return !f.from && !f.to && !f.task && !f.field && !f.model && (f.kind ?? "all") === "all";
}

/** The filters as a SQL condition on `r` (runs), `s` (field_sessions) and `l` (run_lanes); dates are UTC calendar days, both ends included. */
function filterWhere(f: SeasonFilters): SQL {
  const parts: SQL[] = [sql`true`];
  if (f.from) parts.push(sql`r.created_at >= ${new Date(`${f.from}T00:00:00Z`).toISOString()}::timestamptz`);
  if (f.to) parts.push(sql`r.created_at < ${new Date(Date.parse(`${f.to}T00:00:00Z`) + DAY_MS).toISOString()}::timestamptz`);
  if (f.task) parts.push(sql`r.task_code = ${f.task}`);
  if (f.field) parts.push(sql`s.field_name = ${f.field}`);
  if (f.kind === "contest") parts.push(contest);
  if (f.kind === "practice") parts.push(sql`not ${contest}`);
  // only a lane some model event names can have flown the model; which of its flights did is decided per flight below
  if (f.model) parts.push(sql`exists (${lanesNamingModel(sql`r.id`, sql`l.lane`, f.model)})`);
  return sql.join(parts, sql` and `);
}

/**
 * The pilot's season as SQL common table expressions, for the queries beside this file:
 * - `season_lanes`: each lane the pilot flew that counts in their record (lib/sync/consent.ts:
 *   a run they created, or one recorded for them that they accepted) and has a result (the
 *   window was started), within the filters; with the server's stored result (run_lanes, derived
 *   by lib/results runResult on every push — never recomputed here);
 * - `season_flights`: those lanes' derived flights, each with the ground time since the lane's
 *   previous landing (`ground_ms`: null for the first flight or when the previous one never landed),
 *   as stored at derive time in `lane_flights` (db/schema/lane-flights.ts), not unpacked from JSON here;
 * - `season_heights`: those flights whose launch an altimeter log matched (launch_heights; when two
 *   logs of a lane matched the same flight, the newer log's).
 * With a model filter, every flight belongs to the model flying at its launch (the model page's
 * rule, db/queries/flight-model.ts): `season_flights` holds the flights of that model, a ground
 * time counts only between two of its flights (as on the model page), and `season_lanes` holds
 * the lanes with at least one such flight, `flight_count` counting only those.
 * Each lane and flight carries `week`, the Monday (UTC) of its run's day, worked out once per lane.
 * A run is a contest run when a contest's draw names it (group_slots.run_id); else practice.
 * The per-lane numbers (maximum, points lost by cause, flight count) are plain columns of run_lanes
 * that PostgreSQL fills from the derivation when it is stored, not read out of its JSON here.
 * Each flight carries `turnaround_ms`: its ground time where it counts as turnaround (turnaround.ts,
 * the one definition), else null; `ground_ms` stays the stored ground time.
 * Each flight also carries `landed` (it has a landing); `season_target_flights` holds the flights with a target;
 * `season_turnarounds` (week, turnaround_ms) each counted turnaround (absent from the lean summary without filters, which
 * reads each week's numbers from season_week_turnarounds, db/schema/season-weeks.ts); `season_durations` (bin, flights) the landed
 * flights per duration bin (DURATION_BIN_SEC), from run_lanes' stored per-lane aggregates when `lean`.
 * `lean` (the summary, db/queries/season/summary.ts): without a model filter, the flights come from the arrays
 * PostgreSQL generates on each lane (run_lanes.season_ground_ms, season_landed_tenths, season_target_sec), unnested
 * inside each aggregate that reads them, and `time_tenths` is null for a flight that did not land; the lanes hold
 * no field name nor contest flag. On the bench's 30,000 flights this replaced 5,000 key lookups into lane_flights,
 * a 30,000-row temporary store (spilled to disk) and five scans of it.
 */
export function seasonScope(pilotId: string, f: SeasonFilters, opts: { lean?: boolean } = {}): SQL {
  // the summary (`lean`) reads neither a lane's field nor whether it was a contest run: without a field filter it
  // leaves out the field's join (every run has its session) and both columns
  const summaryOnly = !f.model && opts.lean === true;
  const lanes = (flightCount: SQL, more: SQL = sql``) => sql`
      select r.id as run_id, l.lane, r.task_code, r.created_at, ${weekOf(sql`r.created_at`)} as week, ${summaryOnly ? sql`` : sql`s.field_name, `}
        l.result_tenths, l.season_max_tenths as max_tenths, ${flightCount} as flight_count, ${summaryOnly ? sql`` : sql`${contestColumn} as contest, `}
        ${sql.join(LOST_PARTS.map((k) => sql`l.${sql.identifier(LOST_COLUMNS[k])} as ${sql.identifier(k)}`), sql`, `)},
        l.season_lost_tenths as lost_tenths, l.season_penalty_points as penalty_points, ${flightsOnSignal(sql`r`)} as flights_on_signal${more}
      from run_lanes l
      join runs r on r.id = l.run_id
      ${summaryOnly && !f.field ? sql`` : sql`join field_sessions s on s.id = r.session_id`}
      left join lane_consents c on c.run_id = l.run_id and c.lane = l.lane
      where l.pilot_user_id = ${pilotId}
        and (r.created_by = ${pilotId} or c.status = 'accepted')
        and l.result_tenths is not null
        and ${filterWhere(f)}`;
  const flightColumns = sql`f.flight_index, f.launch_ms, f.land_ms, f.status, f.time_tenths, f.credited_tenths, f.target_sec`;
  const turnaround = (groundMs: SQL, onSignal: SQL) => sql`case when ${isTurnaround(groundMs, onSignal)} then ${groundMs} end as turnaround_ms`;
  // one height per flight, the newest log's (then its first launch): picked once over the season's matched
  // launches and joined to the flights, rather than looked up flight by flight (30,000 lookups in the bench)
  // (without a model filter the flight is read by its key from lane_flights, so the few matched launches drive
  // the join and no hash of every season flight is built; with one, only the model's flights count)
  const heights = (flights: "season_flights" | "lane_flights") => sql`season_heights as materialized (
      select f.created_at, f.week, f.time_tenths, f.land_ms, h.height_m
      from (
        select distinct on (h.run_id, h.lane, h.flight_index) h.run_id, h.lane, h.flight_index, h.height_m
        from launch_heights h join altimeter_logs g on g.id = h.log_id
        where h.flight_index is not null and h.run_id in (select run_id from season_lanes)
        order by h.run_id, h.lane, h.flight_index, g.created_at desc, h.at_ms
      ) h
      ${flights === "season_flights"
        ? sql`join season_flights f on f.run_id = h.run_id and f.lane = h.lane and f.flight_index = h.flight_index`
        : sql`join season_lanes sl on sl.run_id = h.run_id and sl.lane = h.lane
      cross join lateral (select sl.created_at, sl.week, lf.time_tenths, lf.land_ms from lane_flights lf
        where lf.run_id = h.run_id and lf.lane = h.lane and lf.flight_index = h.flight_index) f`}
    )`;
  // the weekly turnaround's and the histogram's inputs from per-flight rows (with a model filter, or outside the summary);
  // the summary without one reads the lanes' stored turnarounds and bin counts instead (below)
  const targetFlights = sql`season_target_flights as (select * from season_flights where target_sec is not null
    ), season_turnarounds as (select week, turnaround_ms from season_flights where turnaround_ms is not null
    ), season_durations as (select least(time_tenths / ${sql.raw(String(DURATION_BIN_SEC * 10))}, ${sql.raw(String(LAST_DURATION_BIN))}) as bin, count(*)::int as flights
      from season_flights where landed group by 1)`;
  if (summaryOnly) {
    // the lanes' flight arrays (run_lanes.season_ground_ms, season_landed_tenths, season_target_sec), unnested
    // where each aggregate reads them: no per-flight rows are fetched, stored or scanned twice, and a filter
    // on the lane (a month, a target task) applies before its flights are unnested
    const unnested = (laneWhere: SQL, where: SQL) => sql`
      select f.run_id, f.lane, f.created_at, f.week, f.time_tenths, f.time_tenths is not null as landed, f.target_sec,
        f.ground_ms, ${turnaround(sql`f.ground_ms`, sql`f.flights_on_signal`)}
      from (
        -- in the select list, the arrays are unnested side by side as the lanes stream past (no table function per lane)
        select sl.run_id, sl.lane, sl.created_at, sl.week, sl.flights_on_signal,
          unnest(sl.season_ground_ms) as ground_ms, unnest(sl.season_landed_tenths) as time_tenths, unnest(sl.season_target_sec) as target_sec
        from season_lanes sl where ${laneWhere}
      ) f
      where ${where}`;
    // without any filter the summary reads the weekly turnarounds from season_week_turnarounds: the lanes carry no
    // turnaround array then (less to store and scan in season_lanes) and there is no season_turnarounds
    const weeklyKept = isUnfiltered(f);
    return sql`
    with season_lanes as materialized (${lanes(sql`l.season_flight_count`, sql`, l.season_ground_ms, l.season_landed_tenths, l.season_target_sec, ${weeklyKept ? sql`` : sql`l.season_turnaround_ms, `}l.season_duration_bins`)}
    ), season_flights as not materialized (${unnested(sql`true`, sql`true`)}
    ), season_target_flights as not materialized (${unnested(sql`sl.season_target_sec is not null`, sql`f.target_sec is not null`)}
    ), ${weeklyKept ? sql`` : sql`season_turnarounds as not materialized (
      -- each lane's turnarounds as PostgreSQL keeps them (run_lanes.season_turnaround_ms: the ground times that are
      -- known and not negative), none in a task launched on signals: isTurnaround, applied per lane instead of per flight
      select sl.week, unnest(sl.season_turnaround_ms) as turnaround_ms from season_lanes sl where not sl.flights_on_signal
    ), `}season_durations as not materialized (
      -- the histogram from each lane's bin counts (run_lanes.season_duration_bins), summed bin by bin in one pass over the lanes
      select unnest(array[${sql.join(Array.from({ length: LAST_DURATION_BIN + 1 }, (_, i) => sql`sum(sl.season_duration_bins[${sql.raw(String(i + 1))}])`), sql`, `)}])::int as flights,
        generate_series(0, ${sql.raw(String(LAST_DURATION_BIN))}) as bin
      from season_lanes sl
    ), ${heights("lane_flights")}`;
  }
  if (!f.model) {
    return sql`
    with season_lanes as materialized (${lanes(sql`l.season_flight_count`)}
    ), season_flights as materialized (
      select sl.run_id, sl.lane, sl.task_code, sl.created_at, sl.week, sl.field_name, ${flightColumns}, f.land_ms is not null as landed,
        f.ground_ms, ${turnaround(sql`f.ground_ms`, sql`sl.flights_on_signal`)}
      from season_lanes sl
      -- each lane's flights by its key (OFFSET 0 keeps the lookup per lane): never a hash of every pilot's flights
      cross join lateral (select * from lane_flights f where f.run_id = sl.run_id and f.lane = sl.lane offset 0) f
    ), ${targetFlights}, ${heights("lane_flights")}`;
  }
  // The model filter counts flights, not windows: each flight belongs to the model flying at its
  // launch (db/queries/flight-model.ts, the model page's rule), a lane is kept when one of its
  // flights flew the model, and a ground time counts only between two flights of that model.
  return sql`
    with season_named_lanes as materialized (${lanes(sql`0`)}
    ), season_model_flights as materialized (
      select sl.run_id, sl.lane, sl.task_code, sl.created_at, sl.week, sl.field_name, sl.flights_on_signal, ${flightColumns}, f.ground_ms, m.model_id,
        lag(m.model_id) over (partition by f.run_id, f.lane order by f.position) as previous_model_id
      from season_named_lanes sl
      join run_lanes l on l.run_id = sl.run_id and l.lane = sl.lane
      join lane_flights f on f.run_id = sl.run_id and f.lane = sl.lane
      cross join lateral (select ${modelAtSql(sql`f.run_id`, sql`f.lane`, launchAtMs(sql`l.derived`, sql`f`))} as model_id) m
    ), season_flights as materialized (
      select run_id, lane, task_code, created_at, week, field_name, flight_index, launch_ms, land_ms, land_ms is not null as landed, status, time_tenths, credited_tenths, target_sec,
        case when previous_model_id = ${f.model} then ground_ms end as ground_ms,
        ${turnaround(sql`(case when previous_model_id = ${f.model} then ground_ms end)`, sql`flights_on_signal`)}
      from season_model_flights where model_id = ${f.model}
    ), season_lanes as materialized (
      select sl.run_id, sl.lane, sl.task_code, sl.created_at, sl.week, sl.field_name, sl.result_tenths, sl.max_tenths, n.flights as flight_count, sl.contest,
        ${sql.join(LOST_PARTS.map((k) => sql`sl.${sql.identifier(k)}`), sql`, `)}, sl.lost_tenths, sl.penalty_points, sl.flights_on_signal
      from season_named_lanes sl
      join (select run_id, lane, count(*)::int as flights from season_flights group by 1, 2) n on n.run_id = sl.run_id and n.lane = sl.lane
    ), ${targetFlights}, ${heights("season_flights")}`;
}

/** A lane's result as a share of its task's maximum (null when the task has no maximum). */
export const shareOf = sql`(case when sl.max_tenths > 0 then sl.result_tenths::float8 / sl.max_tenths end)`;

/** The Monday (UTC) of the week of `column`, as a date. */
export const weekOf = (column: SQL) => sql`(date_trunc('week', ${column} at time zone 'UTC'))::date`;
