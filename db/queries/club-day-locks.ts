import "server-only";
import { sql, type SQL } from "drizzle-orm";
import { FIELD_RADIUS_M } from "@/lib/days/matching";
import { lockRuns, type Tx } from "./sync-db";

/**
 * Whether a session may be at a club field by the day matching's rule (lib/days/matching.ts
 * fieldOfSession), in SQL: its name is the field's, or both have a position and they lie within
 * FIELD_RADIUS_M (+1 m, so the database's rounding never leaves out a session the matcher keeps).
 * Wider than the rule (a same-name session far away passes here): the matcher decides; this finds the
 * candidates and the days to lock. `s` and `f` are the aliases of field_sessions and club_fields.
 */
export const maybeAtFieldSql = (s: string, f: string): SQL => {
  const [sLat, sLon, fLat, fLon] = [`${s}.latitude`, `${s}.longitude`, `${f}.latitude`, `${f}.longitude`].map((c) => sql.raw(c));
  return sql`(${fieldKeySql(sql.raw(`${s}.field_name`))} = ${fieldKeySql(sql.raw(`${f}.name`))}
    or (${sLat} is not null and ${sLon} is not null and ${fLat} is not null and ${fLon} is not null
      and 2 * 6371008.8 * asin(least(1, sqrt(power(sin(radians(${fLat} - ${sLat}) / 2), 2)
        + cos(radians(${sLat})) * cos(radians(${fLat})) * power(sin(radians(${fLon} - ${sLon}) / 2), 2)))) <= ${FIELD_RADIUS_M + 1}))`;
};

/** A field's name as the day matching compares it (lib/days/matching.ts fieldKey: case and spacing ignored), in SQL. */
export const fieldKeySql = (name: SQL): SQL => sql`lower(regexp_replace(btrim(${name}), '\\s+', ' ', 'g'))`;

/**
 * The lock that orders a sync against a day's close (db/queries/club-days.ts closeClubDay). The close
 * takes its days' rows FOR UPDATE, then keeps the runs that belong to them (freezeDayRuns). A writer of
 * runs (a push, a re-derivation: db/queries/runs.ts storeDerivations) takes FOR SHARE, in the statement
 * that stores their results, the rows of every club day not yet frozen that those runs might belong to:
 * at a field their session may have been at (its name, or its position within the matching's radius:
 * maybeAtFieldSql), within three days of the run's set-up (wider than the
 * board's candidate window: a day's local bounds ± one day, time zones within ±14 h). So:
 * - a push that holds the share lock first makes the close wait until it commits; the close's next
 *   statements (read committed: a new snapshot each) then see its runs;
 * - a push that comes while the close holds its lock waits until the close commits, finds the day frozen
 *   (the row is checked again after the wait) and commits outside it, as a later sync does.
 * Shares do not block each other, so pushes never wait on one another here; rows in id order, as the
 * close takes them. Only club_days rows matching the runs are touched: no table lock.
 * Returns the body of a CTE for `with held_days as (…)`, over the run ids `runIds` (a list of uuids).
 */
export function holdOpenDays(runIds: SQL): SQL {
  return sql`select d.id from club_days d
    join club_fields f on f.id = d.field_id
    join field_sessions s on ${maybeAtFieldSql("s", "f")}
    join runs r on r.session_id = s.id
    where r.id in (${runIds}) and d.runs_frozen_at is null
      and d.day between (r.created_at - interval '3 days')::date and (r.created_at + interval '3 days')::date
    order by d.id
    for share of d`;
}

/**
 * Takes the day locks of holdOpenDays for these runs now, in their own statement: a push calls it
 * before it locks or deletes any run (lockRuns, applyDiscards), so it takes the days before the runs,
 * the order of the close (days FOR UPDATE, then the runs' keys as it keeps them). Taken only when the
 * results are stored, a push that had deleted a window (its row locked) could wait for a close's day
 * while that close waited for the deleted run's key: a deadlock
 * (tests/integration/club-day-close-deadlock.test.ts). storeDerivations takes them again (held already).
 */
export async function holdDaysOfRuns(tx: Tx, runIds: readonly string[]): Promise<void> {
  const statement = holdDaysSql(runIds);
  if (statement) await tx.execute(statement);
}

/** holdDaysOfRuns' statement (null when there is no run). */
export function holdDaysSql(runIds: readonly string[]): SQL | null {
  const ids = [...new Set(runIds)];
  if (ids.length === 0) return null;
  return sql`${holdOpenDays(sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `))}`;
}

/**
 * The lock order for any writer that re-derives runs outside a push (db/queries/runs.ts
 * deriveAndStoreRuns, an officer's set-aside): the open days those runs may belong to FOR SHARE first,
 * then the runs' rows (lockRuns), as the push and the close take them — taking the runs first would let
 * a close that holds the day and waits for the run's key deadlock with this writer, which holds the run
 * and waits for the day when it stores the results.
 */
export async function holdDaysThenLockRuns(tx: Tx, runIds: readonly string[]): Promise<void> {
  await holdDaysOfRuns(tx, runIds);
  await lockRuns(tx, runIds);
}
